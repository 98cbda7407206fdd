namespace LongRecord.Analysis.Settings;

/// <summary>Windows and rate averaging of the rhythm stage.</summary>
public sealed record RhythmSettings
{
    /// <summary>Length of a trend row (hourly table), seconds. 3600 by the design.</summary>
    public double TrendWindowS { get; init; } = 3600;

    /// <summary>
    /// Align trend rows and HRV segments to the clock (rows start on the hour) when the recording has a start time;
    /// otherwise rows start at elapsed multiples of the window. Common practice, no source.
    /// </summary>
    public bool AlignToClock { get; init; } = true;

    /// <summary>
    /// Beats averaged for the minimum and maximum heart rate (a sliding mean over this many RR intervals, so one
    /// premature beat with its compensatory pause cannot set the maximum). 8 beats: common practice, no source.
    /// </summary>
    public int RateAveragingBeats { get; init; } = 8;

    /// <summary>
    /// Least share of a window's span that must be analysable for its figures to be given; below it the window is
    /// marked insufficient and its figures are left empty. 0.5: common practice, no source.
    /// </summary>
    public double MinAnalysableFraction { get; init; } = 0.5;

    /// <summary>
    /// An interval between consecutive beats longer than this is a gap in the beat record (missed detections, no
    /// signal), not a pause: its time is not analysable. 10 s: the same rule the AF scoring uses; no other source.
    /// </summary>
    public double MaxBeatGapS { get; init; } = 10;

    internal static readonly SettingField<RhythmSettings>[] Fields =
    [
        new("trendWindowS", s => s.TrendWindowS, (s, v) => s with { TrendWindowS = v }, 300, 86400),
        SettingField<RhythmSettings>.Flag("alignToClock", s => s.AlignToClock, (s, v) => s with { AlignToClock = v }),
        new("rateAveragingBeats", s => s.RateAveragingBeats, (s, v) => s with { RateAveragingBeats = (int)v }, 1, 120, whole: true),
        new("minAnalysableFraction", s => s.MinAnalysableFraction, (s, v) => s with { MinAnalysableFraction = v }, 0, 1),
        new("maxBeatGapS", s => s.MaxBeatGapS, (s, v) => s with { MaxBeatGapS = v }, 3, 120),
    ];
}
