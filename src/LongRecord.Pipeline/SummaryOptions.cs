namespace LongRecord.Pipeline;

/// <summary>What a summary run does beyond the defaults.</summary>
public sealed record SummaryOptions
{
    /// <summary>Samples per lead read and analysed at a time (results do not depend on it).</summary>
    public int BlockSamples { get; init; } = 1 << 16;

    /// <summary>
    /// Run the beats stage's delineation and classification on threads of their own, overlapping conditioning, quality and
    /// detection (results do not depend on it). Worth it when a core would otherwise stand idle: one recording at a
    /// time on a machine with two or more.
    /// </summary>
    public bool SecondBeatsThread { get; init; } = Environment.ProcessorCount > 1;

    /// <summary>
    /// Re-analysis: take beats from this annotator extension beside the record (<c>qrs</c>, <c>atr</c>, <c>ecg</c>) or
    /// this file (WFDB annotations or a CSV of R times) instead of detecting them; null detects.
    /// </summary>
    public string? Beats { get; init; }

    /// <summary>
    /// A patient diary (CSV <c>time,text</c>) to read instead of <c>&lt;recording name&gt;.diary.csv</c> beside the
    /// recording (from <c>--diary PATH</c>); null looks beside the recording.
    /// </summary>
    public string? Diary { get; init; }

    /// <summary>Every analysis threshold (from <c>--settings PATH</c>); null uses the documented defaults.</summary>
    public LongRecord.Analysis.Settings.AnalysisSettings? Settings { get; init; }

    /// <summary>How the report is written (template, de-identification); described in the fingerprint by what it changes.</summary>
    [System.Text.Json.Serialization.JsonIgnore]
    public Report.ReportOptions Report { get; init; } = LongRecord.Pipeline.Report.ReportOptions.Default;
}
