using LongRecord.Formats;
using LongRecord.Synthesis.Scenarios;

namespace LongRecord.Synthesis.Tests;

/// <summary>Scenario validation: every problem reported at once, in one one-line message naming segment and field.</summary>
public sealed class ScenarioLoaderTests
{
    [Fact]
    public void EveryCatalogueScenario_LoadsAndSynthesises()
    {
        var files = Directory.GetFiles(ScenarioFiles.Folder, "*.json");
        Assert.True(files.Length >= 18, $"{files.Length} scenarios");
        foreach (var file in files)
        {
            var scenario = ScenarioLoader.Load(file);
            Assert.Equal(Path.GetFileNameWithoutExtension(file), scenario.Name);
            var rec = SyntheticRecording.Create(scenario, new SynthesisOptions { Hours = Math.Min(scenario.TimelineDurationS, 600) / 3600.0 });
            Assert.NotEmpty(rec.Truth.Beats);
        }
    }

    [Fact]
    public void InvalidScenario_ListsEveryProblemInOneMessage()
    {
        const string json = """
        {
          "name": "broken",
          "startDateTime": "2026-03-02 9h40",
          "samplingRateHz": 50,
          "leads": [{"label": "ECG1", "view": "II"}, {"label": "ECG1", "view": "aVR"}],
          "segments": [
            {"rhythm": "sinus", "durationS": 60, "events": [{"atS": 90, "kind": "pvc"}]},
            {"rhythm": "psvt", "durationS": 60, "rateBpm": 300, "conduction": "2:1"},
            {"rhythm": "atrial-flutter", "durationS": -5, "conduction": "5:1"},
            {"rhythm": "torsades", "durationS": 10},
            {"rhythm": "af", "durationS": 30, "rrCV": 0.3}
          ],
          "noise": [{"kind": "muscle", "startS": 100, "durationS": 60, "leads": ["ECG9"]}]
        }
        """;
        var e = Assert.Throws<RecordingFormatException>(() => ScenarioLoader.Parse(json, "broken.json"));
        Assert.DoesNotContain('\n', e.Message);
        Assert.StartsWith("broken.json: ", e.Message);
        string[] expected =
        [
            "startDateTime: must be a local date-time",
            "samplingRateHz: must be between 100 and 1000",
            "leads[1].view: must be one of II, V1, V5",
            "leads[1].label: 'ECG1' is used twice",
            "segments[0] (sinus).events[0].atS: must be between 0 and 60",
            "segments[1] (psvt).rateBpm: must be between 150 and 250",
            "segments[1] (psvt).conduction: does not apply to rhythm psvt",
            "segments[2] (atrial-flutter).durationS: must be between 1 and",
            "segments[2] (atrial-flutter).conduction: must be one of 2:1, 3:1, 4:1, variable",
            "segments[3].rhythm: must be one of",
            "segments[4] (af).rrCV: is not a known field",
            "noise[0].snrDb: is required",
            "noise[0].leads: names lead 'ECG9'",
            "noise[0].durationS: the stretch ends at 160 s, after the timeline's",
        ];
        foreach (var fragment in expected)
        {
            Assert.Contains(fragment, e.Message);
        }

        Assert.Contains($"{expected.Length} problems in the scenario", e.Message);
    }

    [Fact]
    public void MalformedJson_ReportsTheByteOffset()
    {
        const string json = "{\n  \"name\": \"x\",\n  \"segments\": [ }";
        var e = Assert.Throws<RecordingFormatException>(() => ScenarioLoader.Parse(json, "bad.json"));
        Assert.Contains("not valid JSON", e.Message);
        Assert.Equal(json.IndexOf('}'), e.ByteOffset);
    }

    [Fact]
    public void MissingFile_IsTheOneBadInputError()
    {
        var e = Assert.Throws<RecordingFormatException>(() => ScenarioLoader.Load("/nonexistent/none.json"));
        Assert.Equal("/nonexistent/none.json", e.FilePath);
    }
}
