using System.Diagnostics;
using System.Text.Json;
using LongRecord.Pipeline.Batch;
using LongRecord.TestSupport;

namespace LongRecord.Cli.Tests.Batch;

/// <summary>
/// The batch issue's resumability: a batch started as a process and killed mid-way, then run again, completes without
/// redoing finished recordings; a second run skips a recording only when its fingerprint matches.
/// </summary>
public sealed class BatchResumeTests
{
    [Fact]
    public void KilledMidway_RerunCompletes_WithoutRedoingFinishedRecordings()
    {
        using var input = new TempFolder("batch-kill");
        using var output = new TempFolder("batch-kill-out");
        const int count = 8;
        for (var i = 0; i < count; i++)
        {
            BatchCli.Synth("sinus-rest", input.Path($"rec{i}.edf"), hours: 0.1, seed: i + 1);
        }

        // One recording at a time, plain lines (output redirected): kill the process once two are reported done.
        var tool = Path.Combine(AppContext.BaseDirectory, "longrecord");
        var start = new ProcessStartInfo(tool) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (var a in new[] { "summarise", input.FullPath, "--out", output.FullPath, "--jobs", "1" })
        {
            start.ArgumentList.Add(a);
        }

        using (var process = Process.Start(start)!)
        {
            var done = 0;
            while (done < 2 && process.StandardOutput.ReadLine() is string line)
            {
                done += line.Contains(" beats over ", StringComparison.Ordinal) ? 1 : 0;
            }

            Assert.Equal(2, done);
            Assert.False(process.HasExited, "the batch finished before it could be killed");
            process.Kill(entireProcessTree: true);
            process.WaitForExit();
        }

        var finished = Directory.GetDirectories(output.FullPath).Where(d => !Path.GetFileName(d).StartsWith('.')).ToArray();
        Assert.InRange(finished.Length, 2, count - 1);
        Assert.False(File.Exists(Path.Combine(output.FullPath, "index.csv")), "a killed batch writes no index");
        var before = finished.ToDictionary(d => Path.GetFileName(d)!, d => (Written: File.GetLastWriteTimeUtc(Path.Combine(d, RecordingFingerprint.FileName)), Digest: Digest(d)));

        var (code, stdout, stderr) = BatchCli.Run("summarise", input.FullPath, "--out", output.FullPath, "--jobs", "2");

        Assert.True(code == 0, stderr);
        Assert.Empty(BatchCli.HiddenEntries(output.FullPath));
        Assert.Equal(count, Directory.GetDirectories(output.FullPath).Length);
        var index = BatchCli.Index(output.FullPath).ToDictionary(r => r["output"]);
        foreach (var (name, was) in before)
        {
            // Not redone: the same fingerprint file, untouched, and the index says so.
            var dir = Path.Combine(output.FullPath, name);
            Assert.Equal(was.Written, File.GetLastWriteTimeUtc(Path.Combine(dir, RecordingFingerprint.FileName)));
            Assert.Equal(was.Digest, Digest(dir));
            Assert.Equal("unchanged", index[name]["status"]);
        }

        Assert.Equal(count - before.Count, index.Values.Count(r => r["status"] == "done"));
        Assert.Equal(before.Count, stdout.Split('\n').Count(l => l.Contains("unchanged, skipped", StringComparison.Ordinal)));
    }

    [Fact]
    public void SecondRun_SkipsUnchanged_RerunsWhatChanged_ForceRerunsAll()
    {
        using var input = new TempFolder("batch-rerun");
        using var output = new TempFolder("batch-rerun-out");
        BatchCli.Synth("sinus-rest", input.Path("one.edf"), hours: 0.03, seed: 1);
        BatchCli.Synth("sinus-rest", input.Path("two.edf"), hours: 0.03, seed: 2);
        var (code, _, stderr) = BatchCli.Run("summarise", input.FullPath, "--out", output.FullPath, "--beats", "atr");
        Assert.True(code == 0, stderr);
        var first = Stamps(output.FullPath);

        (code, _, stderr) = BatchCli.Run("summarise", input.FullPath, "--out", output.FullPath, "--beats", "atr");
        Assert.True(code == 0, stderr);
        Assert.Equal(first, Stamps(output.FullPath));
        Assert.All(BatchCli.Index(output.FullPath), r => Assert.Equal("unchanged", r["status"]));

        // The --beats annotation file of one recording changes (another valid annotation file put in its place).
        File.Copy(input.Path("one.atr"), input.Path("two.atr"), overwrite: true);
        (code, var stdout, stderr) = BatchCli.Run("summarise", input.FullPath, "--out", output.FullPath, "--beats", "atr", "--verbose");
        Assert.True(code == 0, stderr);
        var third = Stamps(output.FullPath);
        Assert.Equal(first["one"], third["one"]);
        Assert.NotEqual(first["two"], third["two"]);
        Assert.Contains("two.edf: analysing (input content changed)", stdout);

        // An option that shapes outputs (beats detected instead of taken from .atr) re-runs both.
        (code, stdout, _) = BatchCli.Run("summarise", input.FullPath, "--out", output.FullPath, "--verbose");
        Assert.Equal(0, code);
        Assert.Contains("one.edf: analysing (options changed)", stdout);
        var fourth = Stamps(output.FullPath);

        // Settings as used are part of it too.
        var settings = input.Write("settings/strict.json", """{ "pauses": { "reportS": 1.5 } }"""u8.ToArray());
        (code, stdout, _) = BatchCli.Run("summarise", input.FullPath, "--out", output.FullPath, "--settings", settings, "--verbose");
        Assert.Equal(0, code);
        Assert.Contains("one.edf: analysing (settings changed)", stdout);
        Assert.Contains("two.edf: analysing (settings changed)", stdout);

        (code, stdout, _) = BatchCli.Run("summarise", input.FullPath, "--out", output.FullPath, "--settings", settings, "--force", "--verbose");
        Assert.Equal(0, code);
        Assert.Contains("one.edf: analysing (--force)", stdout);
        Assert.All(BatchCli.Index(output.FullPath), r => Assert.Equal("done", r["status"]));
        Assert.NotEqual(fourth["one"], Stamps(output.FullPath)["one"]);
    }

    [Fact]
    public void LeftoversOfAKilledRun_AreRemoved_AndTheRecordingRedone()
    {
        using var input = new TempFolder("batch-stale");
        using var output = new TempFolder("batch-stale-out");
        BatchCli.Synth("sinus-rest", input.Path("rec.edf"), hours: 0.03);
        // What a run killed while writing (a temporary folder) or while replacing a result (the old one moved aside) leaves.
        Directory.CreateDirectory(Path.Combine(output.FullPath, ".rec.partial-0123456789abcdef", "beats.csv"));
        Directory.CreateDirectory(Path.Combine(output.FullPath, ".rec.old-fedcba9876543210"));
        var (code, _, stderr) = BatchCli.Run("summarise", input.FullPath, "--out", output.FullPath);
        Assert.True(code == 0, stderr);
        Assert.Empty(BatchCli.HiddenEntries(output.FullPath));
        Assert.Equal("done", Assert.Single(BatchCli.Index(output.FullPath))["status"]);
    }

    private static string Digest(string folder)
    {
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, RecordingFingerprint.FileName)));
        return doc.RootElement.GetProperty("digest").GetString()!;
    }

    private static Dictionary<string, DateTime> Stamps(string outputRoot) =>
        Directory.GetDirectories(outputRoot).ToDictionary(d => Path.GetFileName(d)!, d => File.GetLastWriteTimeUtc(Path.Combine(d, RecordingFingerprint.FileName)));
}
