using LongRecord.Synthesis.Scenarios;

namespace LongRecord.Synthesis.Tests;

/// <summary>Locates the scenario catalogue in <c>fixtures/scenarios</c> of the repository holding the test assembly.</summary>
internal static class ScenarioFiles
{
    private static readonly Lazy<string> s_folder = new(() =>
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "fixtures", "scenarios");
            if (Directory.Exists(candidate))
            {
                return candidate;
            }
        }

        throw new DirectoryNotFoundException($"fixtures/scenarios not found above {AppContext.BaseDirectory}");
    });

    public static string Folder => s_folder.Value;

    public static string PathOf(string name) => Path.Combine(Folder, name + ".json");

    public static Scenario Load(string name) => ScenarioLoader.Load(PathOf(name));

    public static SyntheticRecording Recording(string name, double? rateHz = null, ulong? seed = null, double? hours = null) =>
        SyntheticRecording.Create(Load(name), new SynthesisOptions { SamplingRateHz = rateHz, Seed = seed, Hours = hours });
}
