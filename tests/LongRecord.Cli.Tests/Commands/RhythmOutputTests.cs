using System.Text.Json;
using LongRecord.TestSupport;

namespace LongRecord.Cli.Tests.Commands;

/// <summary>The rhythm outputs of <c>summarise</c> (rhythm issue, "Outputs" and "Settings").</summary>
public sealed class RhythmOutputTests
{
    [Fact]
    public void Summarise_WritesHourlyEpisodesAndSummary_WithTheContractColumnsAndKeys()
    {
        using var input = new TempFolder("rhythm");
        using var output = new TempFolder("rhythm-out");
        Run("synth", "pauses-and-av-block", "--out", input.Path("rec.edf"));
        var (code, _, stderr) = Run("summarise", input.Path("rec.edf"), "--out", output.FullPath);
        Assert.True(code == 0, stderr);
        var dir = Path.Combine(output.FullPath, "rec");

        var episodes = File.ReadAllLines(Path.Combine(dir, "episodes.csv"));
        Assert.StartsWith("id,kind,start_s,end_s,duration_s,beats,mean_bpm,max_bpm", episodes[0]);
        Assert.Contains(episodes.Skip(1), l => l.Split(',')[1] == "pause");

        var hourly = File.ReadAllLines(Path.Combine(dir, "hourly.csv"));
        foreach (var column in new[] { "analysable_min", "beats", "min_bpm", "mean_bpm", "max_bpm", "sve", "ve", "af_min", "pauses", "sdnn_ms", "rmssd_ms" })
        {
            Assert.Contains(column, hourly[0].Split(','));
        }

        using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(dir, "summary.json")));
        var root = summary.RootElement;
        foreach (var key in new[] { "total_beats", "analysable_percent", "hr_min_bpm", "hr_mean_bpm", "hr_max_bpm", "af_burden_percent", "pause_count", "tool_version", "settings" })
        {
            Assert.True(root.TryGetProperty(key, out _), $"summary.json lacks {key}");
        }

        Assert.Equal(File.ReadAllLines(Path.Combine(dir, "beats.csv")).Length - 1, root.GetProperty("total_beats").GetInt32());
        Assert.Equal(episodes.Skip(1).Count(l => l.Split(',')[1] == "pause"), root.GetProperty("pause_count").GetInt32());
        Assert.Equal(2.0, root.GetProperty("settings").GetProperty("pauses").GetProperty("reportS").GetDouble());
    }

    [Fact]
    public void Settings_ChangeTheFiguresAndAreWrittenIntoTheSummary()
    {
        using var input = new TempFolder("settings");
        using var output = new TempFolder("settings-out");
        Run("synth", "pauses-and-av-block", "--out", input.Path("rec.edf"));
        var settings = input.Write("strict.json", """{ "pauses": { "reportS": 3.0, "highlightS": 3.5 } }"""u8.ToArray());
        Run("summarise", input.Path("rec.edf"), "--out", output.Path("default"));
        var (code, _, stderr) = Run("summarise", input.Path("rec.edf"), "--settings", settings, "--out", output.Path("strict"));
        Assert.True(code == 0, stderr);
        int Pauses(string run)
        {
            using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(output.Path(run), "rec", "summary.json")));
            Assert.Equal(run == "strict" ? 3.0 : 2.0, doc.RootElement.GetProperty("settings").GetProperty("pauses").GetProperty("reportS").GetDouble());
            return doc.RootElement.GetProperty("pause_count").GetInt32();
        }

        // The scenario scripts sinus arrest of 2.4 and 3.2 s (fixtures/scenarios/README.md): a 3.0 s threshold keeps fewer.
        Assert.True(Pauses("strict") < Pauses("default"));
    }

    [Fact]
    public void BadSettings_EveryProblemInOneLine_ExitTwo_NothingRead()
    {
        using var input = new TempFolder("badsettings");
        var settings = input.Write("bad.json", """{ "pauses": { "reportS": -1 }, "nonsense": 3 }"""u8.ToArray());
        var (code, _, stderr) = Run("summarise", "no-such-recording.edf", "--settings", settings, "--out", input.Path("out"));
        Assert.Equal(2, code);
        var line = Assert.Single(stderr.Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.Contains("reportS", line);
        Assert.Contains("nonsense", line);
        Assert.False(Directory.Exists(input.Path("out")));
    }

    private static (int Code, string Stdout, string Stderr) Run(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        return (Program.Run(args, o, e), o.ToString(), e.ToString());
    }
}
