namespace LongRecord.Reporting.Model;

/// <summary>What was analysed.</summary>
/// <param name="Name">Recording name (or the pseudonym when de-identified).</param>
/// <param name="Format">Format detail, for example <c>EDF+C</c>.</param>
/// <param name="Start">Clock time of the first sample as recorded, or null (times are then elapsed).</param>
/// <param name="BeatSource"><c>detected</c>, or the annotation file the beats came from.</param>
/// <param name="SignalAnalysed">False when beats came from annotations alone (no strips then).</param>
public sealed record ReportRecording(
    string Name,
    string Format,
    DateTime? Start,
    double DurationS,
    double ReferenceRateHz,
    IReadOnlyList<string> Leads,
    string BeatSource,
    bool SignalAnalysed);
