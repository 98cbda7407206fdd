using System.Globalization;
using System.Text.Json;
using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Cli.Tests.Batch;

/// <summary>
/// The batch issue's first check: synthetic recordings plus one truncated file, one with a corrupt header and one
/// empty file → every good recording gets its full output, every bad one an index line with its error, exit code 3,
/// no partial folders.
/// </summary>
public sealed class BatchFaultIsolationTests
{
    // Every file summarise writes per recording (README, "What summarise writes"), plus the batch's fingerprint.
    private static readonly string[] s_outputFiles = ["beats.csv", "episodes.csv", "fingerprint.json", "hourly.csv", "quality.csv", "report.fhir.json", "report.pdf", "summary.json"];

    [Fact]
    public void GoodAndBadRecordings_GoodOnesComplete_BadOnesIndexedWithTheirError_ExitThree()
    {
        using var input = new TempFolder("batch-faults");
        using var output = new TempFolder("batch-faults-out");
        BatchCli.Synth("sinus-rest", input.Path("clinic-a/rec.edf"), hours: 0.05);
        BatchCli.Synth("sinus-rest", input.Path("clinic-b/rec.edf"), hours: 0.05, seed: 2);
        BatchCli.Synth("af", input.Path("af.edf"));
        BatchCli.Synth("pauses-and-av-block", input.Path("pauses.edf"));
        var good = File.ReadAllBytes(input.Path("af.edf"));
        input.Write("bad/truncated.edf", good[..(good.Length / 3)]);
        var corrupt = good.ToArray();
        "x1y2z3w4"u8.CopyTo(corrupt.AsSpan(184)); // EDF header field "number of bytes in header record" (EDF spec, bytes 184–191)
        input.Write("bad/corrupt-header.edf", corrupt);
        input.Write("bad/empty.edf", []);

        var (code, stdout, stderr) = BatchCli.Run("summarise", input.FullPath, "--out", output.FullPath, "--jobs", "2", "--timings");

        Assert.Equal(3, code);
        var folders = Directory.GetDirectories(output.FullPath).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray();
        Assert.Equal(new[] { "af", "pauses", $"rec-{Pipeline.Inputs.RecordingDiscovery.ShortHash("clinic-a/rec.edf")}", $"rec-{Pipeline.Inputs.RecordingDiscovery.ShortHash("clinic-b/rec.edf")}" }.Order(StringComparer.Ordinal), folders);
        Assert.Empty(BatchCli.HiddenEntries(output.FullPath));
        foreach (var folder in folders)
        {
            var dir = Path.Combine(output.FullPath, folder!);
            var name = folder!.StartsWith("rec-", StringComparison.Ordinal) ? "rec" : folder;
            Assert.Equal(s_outputFiles.Append($"{name}.beats").Order(StringComparer.Ordinal), Directory.GetFiles(dir).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        }

        // The beats of each good recording against the synthesiser's truth annotations (NAME.atr beside it).
        foreach (var (rel, folder) in new[] { ("clinic-a/rec", folders[2]), ("clinic-b/rec", folders[3]), ("af", "af"), ("pauses", "pauses") })
        {
            var truth = WfdbAnnotationReader.Read(input.Path(rel + ".atr")).Count(a => a.IsBeat);
            var found = File.ReadLines(Path.Combine(output.FullPath, folder!, "beats.csv")).Count() - 1;
            // Within 2 %: beats in unanalysable seconds are left out by design (README, beats stage); common practice, no source.
            Assert.InRange(found, truth * 0.98, truth * 1.02);
        }

        var index = BatchCli.Index(output.FullPath);
        Assert.Equal(7, index.Count);
        var byName = index.ToDictionary(r => r["recording"]);
        foreach (var (rel, problem) in new[] { ("bad/truncated.edf", "data record"), ("bad/corrupt-header.edf", "header"), ("bad/empty.edf", "the file has 0") })
        {
            var row = byName[rel];
            Assert.Equal("failed", row["status"]);
            Assert.StartsWith(rel + ": ", row["reason"]);
            Assert.Contains(problem, row["reason"]);
            Assert.Equal("", row["report"]);
            Assert.Contains(row["reason"], stderr);
        }

        Assert.Equal(3, stderr.Split('\n', StringSplitOptions.RemoveEmptyEntries).Length);
        // No patient-identifying folder names above the input root in anything printed or written.
        Assert.DoesNotContain(input.FullPath, stderr);
        Assert.DoesNotContain(input.FullPath, File.ReadAllText(Path.Combine(output.FullPath, "index.csv")));

        // Durations as synthesised: 0.05 h by --hours; af 360 s (fixtures/scenarios/af.json: 60 + 240 + 60 s).
        Assert.Equal("0.05", byName["clinic-a/rec.edf"]["duration_h"]);
        Assert.Equal((360 / 3600.0).ToString("0.00", CultureInfo.InvariantCulture), byName["af.edf"]["duration_h"]);
        // Episodes by kind against the scenarios: af.json scripts one 240 s AF stretch (≥ 30 s: an AF episode);
        // pauses-and-av-block.json two sinus arrests of 2.4 and 3.2 s (≥ 2.0 s: pauses); sinus-rest none.
        Assert.Equal("1", byName["af.edf"]["episodes_af"]);
        Assert.Equal("2", byName["pauses.edf"]["episodes_pause"]);
        Assert.Equal("0", byName["clinic-a/rec.edf"]["episodes_af"]);
        Assert.Equal("0", byName["clinic-a/rec.edf"]["episodes_pause"]);
        // The index shows what summary.json says.
        using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(output.FullPath, "af", "summary.json")));
        Assert.Equal(summary.RootElement.GetProperty("af_burden_percent").GetDouble(), double.Parse(byName["af.edf"]["af_burden_percent"], CultureInfo.InvariantCulture), 2);
        Assert.Equal("af/report.pdf", byName["af.edf"]["report"]);

        var html = File.ReadAllText(Path.Combine(output.FullPath, "index.html"));
        Assert.Contains("href=\"af/report.pdf\"", html);
        Assert.Equal(3, html.Split("<tr class=\"failed\">").Length - 1);
        Assert.Contains("[7/7]", stdout);
        // --timings: every stage of each analysed recording, and the batch's sums.
        foreach (var stage in new[] { "read", "conditioning", "quality", "detection", "delineation", "classification", "rhythm", "outputs" })
        {
            Assert.Contains($" {stage} ", stdout.Split('\n').Single(l => l.Contains("af.edf: timings ", StringComparison.Ordinal)));
        }

        Assert.Contains("timings over 4 analysed recording(s): read ", stdout);
    }
}
