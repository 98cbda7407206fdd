namespace LongRecord.Analysis.Settings;

/// <summary>
/// Thresholds of the episode stage (tachycardia, runs, bigeminy, classification, onset and offset, atrial activity,
/// review), kept here so one file holds every threshold.
/// </summary>
public sealed record EpisodeSettings
{
    /// <summary>Rate above which a run is a tachycardia, bpm. 100 bpm: common practice, no source.</summary>
    public double TachycardiaRateBpm { get; init; } = 100;

    /// <summary>Fewest consecutive ectopic beats that make a run (two make a couplet). 3: common practice, no source.</summary>
    public int RunMinimumBeats { get; init; } = 3;

    /// <summary>Fewest normal–ectopic cycles in a row that make bigeminy. 3: common practice, no source.</summary>
    public int BigeminyMinimumCycles { get; init; } = 3;

    /// <summary>
    /// Two runs of fast beats separated by at most this many slower beats are one candidate (a short interruption).
    /// 3: common practice, no source.
    /// </summary>
    public int MergeGapBeats { get; init; } = 3;

    /// <summary>
    /// Ectopic beats above the tachycardia rate for less than this are a run (<c>sve-run</c>, <c>ve-run</c>); from this
    /// on a tachycardia kind. 30 s: the rule (the usual boundary of a sustained tachycardia, common practice).
    /// </summary>
    public double SustainedS { get; init; } = 30;

    /// <summary>QRS width from which a complex is broad, ms. 120 ms: common practice (bundle-branch-block width), no source.</summary>
    public double BroadQrsMs { get; init; } = 120;

    /// <summary>
    /// Mean absolute successive RR difference ÷ mean RR above which a tachycardia is irregular (a slow trend, as in
    /// the rise of a sinus tachycardia, does not count). 0.08: our choice (sinus tachycardia and re-entry stay within
    /// a few per cent; AF with an RR coefficient of variation of 0.2 gives about 0.25).
    /// </summary>
    public double IrregularRrChange { get; init; } = 0.08;

    /// <summary>
    /// Onset ratio (first fast RR ÷ mean of the four RR before it, after Swerdlow et al. 1994) at or below which the
    /// onset is abrupt. 0.8: our choice within the range of such criteria (from memory).
    /// </summary>
    public double AbruptOnsetRatio { get; init; } = 0.8;

    /// <summary>Offset ratio (first RR after the episode ÷ mean of its last four RR) at or above which it ends abruptly. 1.2: our choice.</summary>
    public double AbruptOffsetRatio { get; init; } = 1.2;

    /// <summary>
    /// A termination is followed by a pause when the RR after the last beat is at least this many times the median of
    /// the next four RR. 1.5: our choice.
    /// </summary>
    public double PostTerminationPauseFactor { get; init; } = 1.5;

    /// <summary>
    /// Beats on each side of an onset over which the share of beats with a P wave is compared (the P-wave test of an
    /// onset, <c>Episodes/OnsetOffset</c>). 16: our choice (enough beats that a few premature atrial beats, whose P
    /// waves the beats stage often misses, do not decide it).
    /// </summary>
    public int OnsetPWaveBeats { get; init; } = 16;

    /// <summary>
    /// The P waves are lost at an onset when the share of beats with one in the episode's first beats is at most this
    /// fraction of the share before it (itself a P wave before every QRS). 0.5: our choice.
    /// </summary>
    public double PWaveLostFraction { get; init; } = 0.5;

    /// <summary>Warm-up and cool-down end where the RR comes within this fraction of the episode's median RR. 0.06: our choice.</summary>
    public double SteadyRrFraction { get; init; } = 0.06;

    /// <summary>Share of beats with a P wave in the PR window from which a P wave precedes every QRS. 0.75: our choice.</summary>
    public double PBeforeQrsShare { get; init; } = 0.75;

    /// <summary>
    /// Share of clean sinus beats in which the beats stage finds the P wave; where a recording's sinus beats before an
    /// episode show it less often (noise), the P-present shares are lowered in proportion. 0.9: our choice, under the
    /// 95.7 % of QTDB's annotated P waves the beats stage finds.
    /// </summary>
    public double SinusPFoundShare { get; init; } = 0.9;

    /// <summary>Share of beats at or below which P waves are absent. 0.35: our choice.</summary>
    public double PAbsentShare { get; init; } = 0.35;

    /// <summary>
    /// Correlation (leads together) between the episode's mean P wave and the sinus P wave below which the P shape is
    /// unlike sinus. 0.8: our choice.
    /// </summary>
    public double SinusPCorrelation { get; init; } = 0.8;

    /// <summary>
    /// Share of beats with a P wave from which an irregular rhythm of several P shapes is multifocal atrial (not AF):
    /// the beats stage misses some ectopic P waves of unusual shape. 0.5: our choice.
    /// </summary>
    public double MultifocalPShare { get; init; } = 0.5;

    /// <summary>Distinct P shapes that make a rhythm multifocal. 3: the usual definition of MAT (common practice).</summary>
    public int MultifocalPShapes { get; init; } = 3;

    /// <summary>
    /// Share of the P waves in the largest shape group from which one pacemaker dominates: sinus rhythm (or one focus)
    /// with premature atrial beats, not multifocal atrial tachycardia, in which no focus leads (common practice; 0.6 our
    /// choice — with PACs every fifth beat the sinus group holds about 80 %, with four foci taking turns about 25 %).
    /// </summary>
    public double DominantPShare { get; init; } = 0.6;

    /// <summary>
    /// Ratio of the atrial spectral peak's power (± 0.3 Hz) to the 3–12 Hz power from which the peak is sharp
    /// (flutter waves). 0.3: our choice.
    /// </summary>
    public double FlutterPeakShare { get; init; } = 0.3;

    /// <summary>
    /// Share of RR intervals within 12 % of a cycle of a whole number of flutter cycles from which the RR cluster at
    /// multiples of the flutter cycle (variable conduction). 0.7: our choice (random RR give about 0.24).
    /// </summary>
    public double FlutterClusterShare { get; init; } = 0.7;

    /// <summary>
    /// Locked-wave index (the mean cycle, its T wave projected out, correlated with itself 1/n cycle later; see
    /// <c>Episodes/LockedAtrialWaves</c>) from which a regular
    /// narrow tachycardia carries atrial waves at n times its rate. 0.75: our choice.
    /// </summary>
    public double LockedWaveIndex { get; init; } = 0.75;

    /// <summary>Seconds of signal read around each end of a candidate (context and the sinus reference before it). 20 s: our choice.</summary>
    public double SignalContextS { get; init; } = 20;

    /// <summary>Most seconds of an episode's own signal analysed (its start and its end; long episodes are sampled). 60 s: our choice.</summary>
    public double SignalMaxS { get; init; } = 60;

    /// <summary>Context on each side of an onset or offset in a review strip, seconds. 5 s: the 5–10 s.</summary>
    public double StripContextS { get; init; } = 5;

    /// <summary>Episodes of one kind closer than this are one group for review (a representative and a count). 600 s: our choice.</summary>
    public double GroupGapS { get; init; } = 600;

    /// <summary>A symptom event this close to an episode (either side) is nearby; also the ± window of an event's rhythm and rate. 60 s: the issue.</summary>
    public double SymptomWindowS { get; init; } = 60;

    /// <summary>Confidence below which an episode is flagged for review as low-confidence. 0.5: our choice.</summary>
    public double LowConfidence { get; init; } = 0.5;

    /// <summary>Stretches of chaotic or flat signal on every lead closer than this are one finding, seconds. 3 s: our choice.</summary>
    public double UrgentMergeS { get; init; } = 3;

    /// <summary>
    /// A short piece of a related kind at most this far from a longer episode is part of it (Episodes/EpisodeFragments).
    /// 5 s: our choice, with the synthetic catalogue at 24 dB visible (pieces of MAT 2.7–2.8 s from the MAT episode).
    /// </summary>
    public double FragmentGapS { get; init; } = 5;

    internal static readonly SettingField<EpisodeSettings>[] Fields =
    [
        new("tachycardiaRateBpm", s => s.TachycardiaRateBpm, (s, v) => s with { TachycardiaRateBpm = v }, 60, 250),
        new("runMinimumBeats", s => s.RunMinimumBeats, (s, v) => s with { RunMinimumBeats = (int)v }, 3, 100, whole: true),
        new("bigeminyMinimumCycles", s => s.BigeminyMinimumCycles, (s, v) => s with { BigeminyMinimumCycles = (int)v }, 2, 100, whole: true),
        new("mergeGapBeats", s => s.MergeGapBeats, (s, v) => s with { MergeGapBeats = (int)v }, 0, 20, whole: true),
        new("sustainedS", s => s.SustainedS, (s, v) => s with { SustainedS = v }, 5, 600),
        new("broadQrsMs", s => s.BroadQrsMs, (s, v) => s with { BroadQrsMs = v }, 90, 200),
        new("irregularRrChange", s => s.IrregularRrChange, (s, v) => s with { IrregularRrChange = v }, 0.01, 0.5),
        new("abruptOnsetRatio", s => s.AbruptOnsetRatio, (s, v) => s with { AbruptOnsetRatio = v }, 0.3, 0.99),
        new("abruptOffsetRatio", s => s.AbruptOffsetRatio, (s, v) => s with { AbruptOffsetRatio = v }, 1.01, 3),
        new("postTerminationPauseFactor", s => s.PostTerminationPauseFactor, (s, v) => s with { PostTerminationPauseFactor = v }, 1.1, 5),
        new("steadyRrFraction", s => s.SteadyRrFraction, (s, v) => s with { SteadyRrFraction = v }, 0.01, 0.3),
        new("onsetPWaveBeats", s => s.OnsetPWaveBeats, (s, v) => s with { OnsetPWaveBeats = (int)v }, 4, 100, whole: true),
        new("pWaveLostFraction", s => s.PWaveLostFraction, (s, v) => s with { PWaveLostFraction = v }, 0, 0.9),
        new("pBeforeQrsShare", s => s.PBeforeQrsShare, (s, v) => s with { PBeforeQrsShare = v }, 0.3, 1),
        new("sinusPFoundShare", s => s.SinusPFoundShare, (s, v) => s with { SinusPFoundShare = v }, 0.3, 1),
        new("pAbsentShare", s => s.PAbsentShare, (s, v) => s with { PAbsentShare = v }, 0, 0.7),
        new("sinusPCorrelation", s => s.SinusPCorrelation, (s, v) => s with { SinusPCorrelation = v }, 0, 1),
        new("multifocalPShare", s => s.MultifocalPShare, (s, v) => s with { MultifocalPShare = v }, 0.2, 1),
        new("multifocalPShapes", s => s.MultifocalPShapes, (s, v) => s with { MultifocalPShapes = (int)v }, 2, 10, whole: true),
        new("dominantPShare", s => s.DominantPShare, (s, v) => s with { DominantPShare = v }, 0.3, 1),
        new("flutterPeakShare", s => s.FlutterPeakShare, (s, v) => s with { FlutterPeakShare = v }, 0.05, 1),
        new("flutterClusterShare", s => s.FlutterClusterShare, (s, v) => s with { FlutterClusterShare = v }, 0.3, 1),
        new("lockedWaveIndex", s => s.LockedWaveIndex, (s, v) => s with { LockedWaveIndex = v }, 0, 1),
        new("signalContextS", s => s.SignalContextS, (s, v) => s with { SignalContextS = v }, 5, 120),
        new("signalMaxS", s => s.SignalMaxS, (s, v) => s with { SignalMaxS = v }, 10, 600),
        new("stripContextS", s => s.StripContextS, (s, v) => s with { StripContextS = v }, 5, 10),
        new("groupGapS", s => s.GroupGapS, (s, v) => s with { GroupGapS = v }, 0, 86400),
        new("symptomWindowS", s => s.SymptomWindowS, (s, v) => s with { SymptomWindowS = v }, 10, 600),
        new("lowConfidence", s => s.LowConfidence, (s, v) => s with { LowConfidence = v }, 0, 1),
        new("urgentMergeS", s => s.UrgentMergeS, (s, v) => s with { UrgentMergeS = v }, 0, 30),
        new("fragmentGapS", s => s.FragmentGapS, (s, v) => s with { FragmentGapS = v }, 0, 60),
    ];
}
