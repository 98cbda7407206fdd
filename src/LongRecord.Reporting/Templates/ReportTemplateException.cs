namespace LongRecord.Reporting.Templates;

/// <summary>A template that cannot be used: its message lists every problem, one per line after the first.</summary>
public sealed class ReportTemplateException(string source, IReadOnlyList<string> problems)
    : Exception($"{source}: {(problems.Count == 1 ? problems[0] : $"{problems.Count} problems: " + string.Join("; ", problems))}")
{
    public IReadOnlyList<string> Problems { get; } = problems;
}
