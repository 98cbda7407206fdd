namespace LongRecord.Analysis.Settings;

/// <summary>
/// Settings that cannot be used. <see cref="Problems"/> lists every problem found (each "path: problem"); the message
/// is one line naming them all.
/// </summary>
public sealed class AnalysisSettingsException(string source, IReadOnlyList<string> problems)
    : Exception($"{source}: {problems.Count} problem{(problems.Count == 1 ? "" : "s")} in the settings: {string.Join("; ", problems)}")
{
    public string SettingsSource { get; } = source;

    public IReadOnlyList<string> Problems { get; } = problems;
}
