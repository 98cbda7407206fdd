using System.Reflection;
using LongRecord.Synthesis.Scenarios;

namespace LongRecord.Cli;

/// <summary>The scenarios of <c>fixtures/scenarios</c>, built into the tool; a scenario is named by file path or by catalogue name.</summary>
public static class ScenarioCatalogue
{
    private const string Prefix = "scenarios/";

    public static IReadOnlyList<string> Names { get; } = typeof(ScenarioCatalogue).Assembly.GetManifestResourceNames()
        .Where(n => n.StartsWith(Prefix, StringComparison.Ordinal))
        .Select(n => Path.GetFileNameWithoutExtension(n[Prefix.Length..]))
        .Order(StringComparer.Ordinal)
        .ToArray();

    /// <summary>Loads <paramref name="nameOrPath"/>: an existing file, else a catalogue name such as <c>psvt-180</c>.</summary>
    public static Scenario Load(string nameOrPath)
    {
        if (File.Exists(nameOrPath))
        {
            return ScenarioLoader.Load(nameOrPath);
        }

        var name = Path.GetFileNameWithoutExtension(nameOrPath);
        using var stream = typeof(ScenarioCatalogue).Assembly.GetManifestResourceStream(Prefix + name + ".json")
            ?? throw new UserInputException($"{nameOrPath}: no such scenario file, and not a built-in scenario ({string.Join(", ", Names)})");
        using var reader = new StreamReader(stream);
        return ScenarioLoader.Parse(reader.ReadToEnd(), name + ".json");
    }
}
