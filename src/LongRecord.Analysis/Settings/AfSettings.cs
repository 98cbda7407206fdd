namespace LongRecord.Analysis.Settings;

/// <summary>
/// The AF detector (see <c>Rhythm/AfDetector</c>) and the AF episode rules. Detector parameters come from physiology
/// and the method's design, not from fitting to any record.
/// </summary>
public sealed record AfSettings
{
    /// <summary>
    /// RR intervals in the detector's sliding window, centred on the interval judged (dropouts, see
    /// <see cref="MaxConductedRrS"/>, take no room in it). 32: our choice, four times the 8 of Petrėnas et al. 2015.
    /// </summary>
    public int WindowBeats { get; init; } = 32;

    /// <summary>
    /// Longest lag at which the window is searched for a repeating RR pattern (2 = bigeminy, 3 = trigeminy or 3:2
    /// conduction). A rhythm that repeats at any lag up to this is not fibrillation. 3: our choice.
    /// </summary>
    public int MaxPatternLag { get; init; } = 3;

    /// <summary>Two RR intervals are alike when they differ by less than this fraction of their mean. 0.06: our choice (sinus beat-to-beat change at rest is a few per cent).</summary>
    public double AlikeFraction { get; init; } = 0.06;

    /// <summary>Floor of the alike tolerance, seconds: covers fiducial jitter at low sampling rates (one sample at 128 Hz is 7.8 ms). 0.02 s: our choice.</summary>
    public double AlikeMinS { get; init; } = 0.02;

    /// <summary>A successive RR difference is large when it exceeds this fraction of the pair's mean. 0.08: our choice.</summary>
    public double LargeDifferenceFraction { get; init; } = 0.08;

    /// <summary>
    /// Fibrillation when the share of large successive differences exceeds the best-lag share of alike pairs by at
    /// least this margin: 0, the window holds more irregular than repeating pairs. Our choice.
    /// </summary>
    public double MinIrregularityMargin { get; init; } = 0;

    /// <summary>
    /// Hysteresis: next to a window at <see cref="MinIrregularityMargin"/>, windows down to this margin stay AF-like
    /// (fibrillation does not stop because a few intervals happen to repeat). −0.1: our choice.
    /// </summary>
    public double HoldIrregularityMargin { get; init; } = -0.1;

    /// <summary>
    /// Ectopic beat filtering: a beat is premature when its RR is at least this fraction shorter than the reference RR
    /// (median of the recent intervals kept). 0.15: our choice.
    /// </summary>
    public double PrematureFraction { get; init; } = 0.15;

    /// <summary>
    /// A premature beat is compensated when its RR plus the next one lie within this fraction of two reference RRs;
    /// both intervals are then left out of the irregularity measure. 0.15: our choice.
    /// </summary>
    public double CompensationTolerance { get; init; } = 0.15;

    /// <summary>
    /// The premature, split and long rules apply only where the recent kept intervals are regular: their median
    /// absolute deviation at most this fraction of their median. 0.065: our choice (sinus rhythm at rest varies by a
    /// few per cent beat to beat), chosen with LTAFDB, MITDB and NSR2DB all visible (see Rhythm/README.md).
    /// </summary>
    public double RegularDeviationFraction { get; init; } = 0.065;

    /// <summary>A kept interval longer than this many reference RRs is a missed beat or a pause and leaves the measure. 1.7: our choice.</summary>
    public double LongRrFactor { get; init; } = 1.7;

    /// <summary>Shortest RR measured, seconds: faster than 250/min is beyond usual AV-nodal conduction. 0.24 s: physiology, from memory.</summary>
    public double MinConductedRrS { get; init; } = 0.24;

    /// <summary>
    /// Longest RR measured, seconds (about 33/min). A longer interval, like one shorter than
    /// <see cref="MinConductedRrS"/>, is a dropout — most often a missed detection — that leaves the measure and takes no
    /// room in the window. 1.8 s: our choice, chosen with LTAFDB, MITDB and NSR2DB all visible (see Rhythm/README.md).
    /// </summary>
    public double MaxConductedRrS { get; init; } = 1.8;

    /// <summary>
    /// Bigeminal suppression: a window in which at least this share of successive pairs swing short–long (two large
    /// differences of opposite sign) is bigeminal, not fibrillation (in fibrillation about 0.45 do). 0.8: our choice.
    /// </summary>
    public double BigeminalSwingShare { get; init; } = 0.8;

    /// <summary>
    /// Atrial evidence: where at least half of a window's beats had their P wave judged, a share of P-present beats
    /// at or above this vetoes fibrillation. 0.7: our choice.
    /// </summary>
    public double PWavePresentVeto { get; init; } = 0.7;

    /// <summary>Atrial evidence: a share of P-present beats at or below this (of judged beats) relaxes the RR criteria by <see cref="AtrialRelief"/>. 0.2: our choice.</summary>
    public double PWaveAbsentSupport { get; init; } = 0.2;

    /// <summary>Mean fibrillatory-wave score (0–1, when the signal provides one) at or above which the RR criteria are relaxed. 0.5: our choice.</summary>
    public double FWaveSupport { get; init; } = 0.5;

    /// <summary>How much supporting atrial evidence relaxes both share criteria. 0.15: our choice.</summary>
    public double AtrialRelief { get; init; } = 0.15;

    /// <summary>Non-AF stretches shorter than this inside AF are bridged (one episode), seconds. 5 s: our choice.</summary>
    public double BridgeS { get; init; } = 5;

    /// <summary>
    /// Stretches the detector could not judge (too few intervals kept: artefact, frequent ectopy) shorter than this,
    /// between AF on both sides, are bridged too, seconds. 5 s: our choice, as for judged interruptions.
    /// </summary>
    public double BridgeUnjudgedS { get; init; } = 5;

    /// <summary>
    /// Unanalysable stretches (noise, lead-off) shorter than this, between AF on both sides, are bridged as well:
    /// fibrillation does not stop because the signal was unreadable for a few seconds; the stretch's own time is not AF
    /// time. 10 s: our choice (as long as the longest beat gap that still counts as an interval, <c>maxBeatGapS</c>).
    /// </summary>
    public double BridgeUnanalysableS { get; init; } = 10;

    /// <summary>
    /// Shortest AF episode, seconds. 30 s: HRS/EHRA/ECAS/APHRS/SOLAECE expert consensus statement on catheter and
    /// surgical ablation of atrial fibrillation (Calkins H et al., Heart Rhythm 2017;14:e275-e444). Shorter AF-like
    /// stretches are reported as af-brief and not counted in the burden.
    /// </summary>
    public double MinEpisodeS { get; init; } = 30;

    internal static readonly SettingField<AfSettings>[] Fields =
    [
        new("holdIrregularityMargin", s => s.HoldIrregularityMargin, (s, v) => s with { HoldIrregularityMargin = v }, -1, 1),
        new("windowBeats", s => s.WindowBeats, (s, v) => s with { WindowBeats = (int)v }, 4, 256, whole: true),
        new("maxPatternLag", s => s.MaxPatternLag, (s, v) => s with { MaxPatternLag = (int)v }, 1, 6, whole: true),
        new("alikeFraction", s => s.AlikeFraction, (s, v) => s with { AlikeFraction = v }, 0.005, 0.5),
        new("alikeMinS", s => s.AlikeMinS, (s, v) => s with { AlikeMinS = v }, 0, 0.2),
        new("largeDifferenceFraction", s => s.LargeDifferenceFraction, (s, v) => s with { LargeDifferenceFraction = v }, 0.005, 1),
        new("minIrregularityMargin", s => s.MinIrregularityMargin, (s, v) => s with { MinIrregularityMargin = v }, -1, 1),
        new("prematureFraction", s => s.PrematureFraction, (s, v) => s with { PrematureFraction = v }, 0, 0.8),
        new("compensationTolerance", s => s.CompensationTolerance, (s, v) => s with { CompensationTolerance = v }, 0, 1),
        new("regularDeviationFraction", s => s.RegularDeviationFraction, (s, v) => s with { RegularDeviationFraction = v }, 0, 1),
        new("longRrFactor", s => s.LongRrFactor, (s, v) => s with { LongRrFactor = v }, 1.1, 4),
        new("minConductedRrS", s => s.MinConductedRrS, (s, v) => s with { MinConductedRrS = v }, 0.1, 1),
        new("maxConductedRrS", s => s.MaxConductedRrS, (s, v) => s with { MaxConductedRrS = v }, 1, 10),
        new("bigeminalSwingShare", s => s.BigeminalSwingShare, (s, v) => s with { BigeminalSwingShare = v }, 0, 1),
        new("pWavePresentVeto", s => s.PWavePresentVeto, (s, v) => s with { PWavePresentVeto = v }, 0, 1),
        new("pWaveAbsentSupport", s => s.PWaveAbsentSupport, (s, v) => s with { PWaveAbsentSupport = v }, 0, 1),
        new("fWaveSupport", s => s.FWaveSupport, (s, v) => s with { FWaveSupport = v }, 0, 1),
        new("atrialRelief", s => s.AtrialRelief, (s, v) => s with { AtrialRelief = v }, 0, 1),
        new("bridgeS", s => s.BridgeS, (s, v) => s with { BridgeS = v }, 0, 120),
        new("bridgeUnjudgedS", s => s.BridgeUnjudgedS, (s, v) => s with { BridgeUnjudgedS = v }, 0, 600),
        new("bridgeUnanalysableS", s => s.BridgeUnanalysableS, (s, v) => s with { BridgeUnanalysableS = v }, 0, 600),
        new("minEpisodeS", s => s.MinEpisodeS, (s, v) => s with { MinEpisodeS = v }, 1, 3600),
    ];
}
