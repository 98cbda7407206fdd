using LongRecord.Synthesis;
using LongRecord.Synthesis.Export;
using LongRecord.Synthesis.Scenarios;

namespace LongRecord.Benchmarks.Analysis;

/// <summary>The synthetic demo day written once as EDF+ into the benchmark folder (a realistic day of beats and events).</summary>
public static class BeatRecordings
{
    public static string DemoDay(double hours = 24)
    {
        var path = Path.Combine(Formats.BenchmarkRecordings.Folder, FormattableString.Invariant($"demo-{hours:0.##}h.edf"));
        if (!File.Exists(path))
        {
            var scenario = ScenarioLoader.Load(ScenarioPath("demo-24h"));
            SyntheticRecordingExport.Write(SyntheticRecording.Create(scenario, new SynthesisOptions { Hours = hours }), path);
        }

        return path;
    }

    private static string ScenarioPath(string name)
    {
        for (var d = new DirectoryInfo(AppContext.BaseDirectory); d is not null; d = d.Parent)
        {
            var p = Path.Combine(d.FullName, "fixtures", "scenarios", name + ".json");
            if (File.Exists(p))
            {
                return p;
            }
        }

        throw new FileNotFoundException($"fixtures/scenarios/{name}.json not found above {AppContext.BaseDirectory}");
    }
}
