using System.Text.Json;
using LongRecord.TestSupport;

namespace LongRecord.Cli.Tests.Episodes;

/// <summary>
/// The episode outputs of <c>summarise</c> (episodes issue, items 6 and 7): <c>episodes.csv</c> keeps the rhythm
/// issue's first columns and adds the class evidence, width, onset, offset, atrial finding, confidence, rank and
/// group; <c>summary.json</c> gains counts by kind (every kind of the list) and the symptom-event table; a
/// diary is read from <c>--diary PATH</c> or from <c>&lt;recording name&gt;.diary.csv</c> beside the recording.
/// The recording is the catalogue's PSVT at 180 bpm from 60 to 180 s (fixtures/scenarios/psvt-180.json).
/// </summary>
public sealed class EpisodeOutputTests
{
    private static readonly string[] s_kinds =
    [
        "sinus-tachycardia", "atrial-tachycardia", "svt", "flutter", "af", "af-brief", "mat", "sinus-with-pacs", "broad-tachycardia", "vf",
        "unclassified-tachycardia", "sve-run", "ve-run", "idioventricular-rhythm", "junctional-rhythm", "ectopic-atrial-rhythm",
        "ventricular-bigeminy", "ventricular-trigeminy", "atrial-bigeminy", "pause", "bradycardia", "signal-loss",
    ];

    [Fact]
    public void Summarise_WithDiaryOption_WritesEpisodeColumnsCountsByKindAndTheSymptomTable()
    {
        using var input = new TempFolder("episodes");
        using var output = new TempFolder("episodes-out");
        Run("synth", "psvt-180", "--out", input.Path("rec.edf"));
        // 14:02:00 is 120 s after the scenario's start (14:00:00), inside the PSVT; 20 s is sinus rhythm.
        var diary = input.Write("entries.csv", "time,text\n2026-03-04T14:02:00,\"racing, pounding\"\n20,walking\n"u8.ToArray());
        var (code, _, stderr) = Run("summarise", input.Path("rec.edf"), "--diary", diary, "--out", output.FullPath);
        Assert.True(code == 0, stderr);
        var dir = Path.Combine(output.FullPath, "rec");

        var lines = File.ReadAllLines(Path.Combine(dir, "episodes.csv"));
        var header = lines[0].Split(',');
        Assert.Equal("id,kind,start_s,end_s,duration_s,beats,mean_bpm,max_bpm".Split(','), header.Take(8));
        foreach (var column in new[] { "evidence", "qrs_ms", "onset", "offset", "atrial_finding", "confidence", "rank", "group" })
        {
            Assert.Contains(column, header);
        }

        Assert.All(lines.Skip(1), l => Assert.Contains(l.Split(',')[1], s_kinds));

        using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(dir, "summary.json")));
        var root = summary.RootElement;
        var byKind = root.GetProperty("episodes_by_kind");
        Assert.Equal(s_kinds, byKind.EnumerateObject().Select(p => p.Name));
        Assert.Equal(lines.Length - 1, byKind.EnumerateObject().Sum(p => p.Value.GetInt32()));
        var events = root.GetProperty("symptom_events").EnumerateArray().ToList();
        Assert.Equal(2, events.Count);
        Assert.Equal(20.0, events[0].GetProperty("time_s").GetDouble(), 3);
        Assert.Equal(120.0, events[1].GetProperty("time_s").GetDouble(), 3);
        Assert.Equal("racing, pounding", events[1].GetProperty("text").GetString());
        Assert.Contains("svt", events[1].GetProperty("rhythm").GetString());
        Assert.InRange(events[1].GetProperty("mean_bpm").GetDouble(), 150, 200);
    }

    [Fact]
    public void Summarise_DiaryBesideTheRecording_IsRead_AndABadOneIsOneLineExitTwo()
    {
        using var input = new TempFolder("diary");
        using var output = new TempFolder("diary-out");
        Run("synth", "psvt-180", "--out", input.Path("rec.edf"));
        input.Write("rec.diary.csv", "time,text\n30,dizzy\n"u8.ToArray());
        var (code, _, stderr) = Run("summarise", input.Path("rec.edf"), "--out", output.Path("good"));
        Assert.True(code == 0, stderr);
        using (var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(output.Path("good"), "rec", "summary.json"))))
        {
            var e = Assert.Single(summary.RootElement.GetProperty("symptom_events").EnumerateArray());
            Assert.Equal("dizzy", e.GetProperty("text").GetString());
            Assert.Equal("diary", e.GetProperty("source").GetString());
        }

        // Line 2 begins after "time,text\n" (10 bytes).
        var bad = input.Write("bad.csv", "time,text\nsoon,dizzy\n"u8.ToArray());
        (code, _, stderr) = Run("summarise", input.Path("rec.edf"), "--diary", bad, "--out", output.Path("bad"));
        Assert.NotEqual(0, code);
        var line = Assert.Single(stderr.Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.Contains("bad.csv", line);
        Assert.Contains("at byte 10", line);
    }

    private static (int Code, string Stdout, string Stderr) Run(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        return (Program.Run(args, o, e), o.ToString(), e.ToString());
    }
}
