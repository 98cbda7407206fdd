using LongRecord.Pipeline.Privacy;
using LongRecord.Reporting.Templates;

namespace LongRecord.Pipeline.Report;

/// <summary>How each recording's report is written: the template, and whether patients are de-identified.</summary>
public sealed record ReportOptions
{
    public static ReportOptions Default { get; } = new();

    public ReportTemplate Template { get; init; } = TemplateLoader.Standard;

    /// <summary>Set when de-identifying: pseudonyms stand for recordings and patients everywhere.</summary>
    public Pseudonyms? Privacy { get; init; }

    /// <summary>Write report.pdf and the FHIR bundle (off only for callers that want the tables alone).</summary>
    public bool Enabled { get; init; } = true;
}
