namespace LongRecord.Analysis.Settings;

/// <summary>Pauses: RR intervals long enough to report.</summary>
public sealed record PauseSettings
{
    /// <summary>Shortest RR reported as a pause, seconds. 2.0 s: common practice, no source.</summary>
    public double ReportS { get; init; } = 2.0;

    /// <summary>Shortest pause highlighted, seconds. 3.0 s: common practice, no source.</summary>
    public double HighlightS { get; init; } = 3.0;

    /// <summary>
    /// A beat is premature when its RR is shorter than the reference RR (median of the preceding intervals) by at
    /// least this fraction; a pause after such a beat is told apart. 0.2: common practice, no source.
    /// </summary>
    public double PrematureFraction { get; init; } = 0.2;

    internal static readonly SettingField<PauseSettings>[] Fields =
    [
        new("reportS", s => s.ReportS, (s, v) => s with { ReportS = v }, 1, 10),
        new("highlightS", s => s.HighlightS, (s, v) => s with { HighlightS = v }, 1, 10),
        new("prematureFraction", s => s.PrematureFraction, (s, v) => s with { PrematureFraction = v }, 0.05, 0.6),
    ];
}
