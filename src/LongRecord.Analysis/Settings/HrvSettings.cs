namespace LongRecord.Analysis.Settings;

/// <summary>
/// Heart-rate variability on normal-to-normal (NN) intervals, as the Task Force of the European Society of Cardiology
/// and the North American Society of Pacing and Electrophysiology defines it (Circulation 1996;93:1043-1065).
/// </summary>
public sealed record HrvSettings
{
    /// <summary>Length of the short-term segments (SDANN, SDNN index, spectra), seconds. Task Force 1996: 5 min.</summary>
    public double SegmentS { get; init; } = 300;

    /// <summary>
    /// Artefact filter on NN intervals: an interval differing from the mean of the last accepted NN intervals by more
    /// than this fraction is not NN (catches ectopy the beat labels missed). 0.2: common practice, no source; 0 turns
    /// the filter off and leaves exclusion to the beat classes alone.
    /// </summary>
    public double NnMaxRelativeChange { get; init; } = 0.2;

    /// <summary>Bin width of the NN histogram for the HRV triangular index, seconds. Task Force 1996: 1/128 s.</summary>
    public double TriangularBinS { get; init; } = 1.0 / 128.0;

    /// <summary>Lower edge of the LF band, Hz (Task Force 1996).</summary>
    public double LfLowHz { get; init; } = 0.04;

    /// <summary>Upper edge of the LF band and lower edge of the HF band, Hz (Task Force 1996).</summary>
    public double LfHighHz { get; init; } = 0.15;

    /// <summary>Upper edge of the HF band, Hz (Task Force 1996).</summary>
    public double HfHighHz { get; init; } = 0.4;

    /// <summary>Rate at which the NN series is resampled for the spectrum, Hz. 4 Hz: common practice, no source.</summary>
    public double ResampleHz { get; init; } = 4;

    /// <summary>
    /// Least share of a segment's span covered by NN intervals for its figures to be given (the spectrum interpolates
    /// across the rest). 0.8: common practice, no source.
    /// </summary>
    public double MinSegmentNnFraction { get; init; } = 0.8;

    internal static readonly SettingField<HrvSettings>[] Fields =
    [
        new("segmentS", s => s.SegmentS, (s, v) => s with { SegmentS = v }, 60, 3600),
        new("nnMaxRelativeChange", s => s.NnMaxRelativeChange, (s, v) => s with { NnMaxRelativeChange = v }, 0, 1),
        new("triangularBinS", s => s.TriangularBinS, (s, v) => s with { TriangularBinS = v }, 0.001, 0.1),
        new("lfLowHz", s => s.LfLowHz, (s, v) => s with { LfLowHz = v }, 0.003, 1),
        new("lfHighHz", s => s.LfHighHz, (s, v) => s with { LfHighHz = v }, 0.003, 1),
        new("hfHighHz", s => s.HfHighHz, (s, v) => s with { HfHighHz = v }, 0.003, 2),
        new("resampleHz", s => s.ResampleHz, (s, v) => s with { ResampleHz = v }, 1, 20),
        new("minSegmentNnFraction", s => s.MinSegmentNnFraction, (s, v) => s with { MinSegmentNnFraction = v }, 0, 1),
    ];

    internal void CheckBands(List<string> problems)
    {
        if (!(LfLowHz < LfHighHz && LfHighHz < HfHighHz))
        {
            problems.Add("hrv: band edges must rise: lfLowHz < lfHighHz < hfHighHz");
        }

        if (HfHighHz >= ResampleHz / 2)
        {
            problems.Add("hrv.hfHighHz: must lie below half of resampleHz");
        }
    }
}
