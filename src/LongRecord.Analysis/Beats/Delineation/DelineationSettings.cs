namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>
/// Settings of <see cref="BeatDelineator"/>, all in milliseconds, hertz or ratios so that one set serves every sampling
/// rate. The defaults were fitted with the QT Database records present here in view (53 of its 105; the others, not
/// present, could confirm them), with the AF, sinus and bundle-branch-block records of the MIT-BIH Arrhythmia Database
/// and with the synthesiser's truth; where a value comes from elsewhere, its line says so.
/// </summary>
public sealed record DelineationSettings
{
    public static DelineationSettings Default { get; } = new();

    // --- QRS -----------------------------------------------------------------------------------------------------

    /// <summary>Corner of the zero-phase low-pass before the QRS derivative (Laguna et al.'s low-passed lead), Hz.</summary>
    public double QrsLowPassHz { get; init; } = 25;

    /// <summary>Corner of the lighter zero-phase low-pass on which the amplitude test of the QRS edges runs, Hz.</summary>
    public double QrsFineLowPassHz { get; init; } = 60;

    /// <summary>How far from the caller's fiducial the QRS centre may lie, ms.</summary>
    public double QrsLocateMs { get; init; } = 150;

    /// <summary>Half-width of the search for the QRS's steepest slope around its centre, ms.</summary>
    public double QrsPeakSearchMs { get; init; } = 90;

    /// <summary>Furthest a QRS boundary may lie from the QRS centre, ms.</summary>
    public double QrsMaxHalfMs { get; init; } = 180;

    /// <summary>A limb (run of one slope sign) is a QRS wave when its slope peak reaches this fraction of the steepest.</summary>
    public double SignificantSlopeFraction { get; init; } = 0.3;

    /// <summary>
    /// A slower limb still counts when its slope reaches this fraction, its height <see cref="SignificantAmplitudeFraction"/>
    /// of the QRS's peak-to-peak amplitude, and it lasts no longer than <see cref="WaveLimbMs"/> (a slow q or s wave).
    /// </summary>
    public double WeakSlopeFraction { get; init; } = 0.12;

    /// <summary>See <see cref="WeakSlopeFraction"/>.</summary>
    public double SignificantAmplitudeFraction { get; init; } = 0.18;

    /// <summary>See <see cref="WeakSlopeFraction"/>, ms.</summary>
    public double WaveLimbMs { get; init; } = 35;

    /// <summary>Slope below this fraction of the steepest counts as quiet.</summary>
    public double QuietSlopeFraction { get; init; } = 0.1;

    /// <summary>A quiet stretch this long ends the QRS (what lies beyond is another wave), ms.</summary>
    public double QuietGapMs { get; init; } = 40;

    /// <summary>An opposite limb this short between two significant limbs is a notch inside the QRS, ms.</summary>
    public double NotchMs { get; init; } = 2;

    /// <summary>K_on of Laguna et al.: the onset is where the slope falls below the first wave's slope peak ÷ K_on.</summary>
    public double OnsetDivisor { get; init; } = 12;

    /// <summary>K_end of Laguna et al. for the QRS end (J point), from the last wave's slope peak.</summary>
    public double OffsetDivisor { get; init; } = 11;

    /// <summary>The onset threshold is at least this fraction of the steepest QRS slope of the lead.</summary>
    public double GlobalOnFraction { get; init; } = 0.015;

    /// <summary>The end threshold is at least this fraction of the steepest QRS slope of the lead.</summary>
    public double GlobalOffFraction { get; init; } = 0.12;

    /// <summary>The slope must stay under the threshold this long for a boundary (a brief dip inside the QRS is not one), ms.</summary>
    public double SustainMs { get; init; } = 18;

    /// <summary>Boundary thresholds never go below this multiple of the lead's activity slope (what it shows outside the QRS).</summary>
    public double NoiseSlopeMultiple { get; init; } = 1;

    /// <summary>Length of the segments whose mean absolute slopes the activity and the noise of a lead are taken from, ms.</summary>
    public double NoiseSegmentMs { get; init; } = 40;

    /// <summary>
    /// The activity slope (the floor of the boundary thresholds) rests on this quantile of the segments' mean absolute
    /// slopes: the median segment, so P, T and fibrillatory waves count and the neighbouring complexes do not.
    /// </summary>
    public double ActivityQuantile { get; init; } = 0.5;

    /// <summary>
    /// The activity slope is this multiple of that quantile: 1.7 makes it the 80th percentile of |slope| under
    /// stationary Gaussian noise (measured on white noise through the 25 Hz low-pass, 1.70 at 250 Hz).
    /// </summary>
    public double ActivityScale { get; init; } = 1.7;

    /// <summary>
    /// The noise slope (for a lead's SNR) rests on this quantile of the segments' mean high-frequency slope (the 25 Hz
    /// band less the 15 Hz band, which P and T waves do not reach): the quiet segments, away from other QRS complexes.
    /// </summary>
    public double NoiseQuantile { get; init; } = 0.2;

    /// <summary>The noise slope is this multiple of that quantile (4.1: the 80th percentile of |slope| under Gaussian noise, 250 Hz).</summary>
    public double NoiseScale { get; init; } = 4.1;

    /// <summary>Half-width of the stretch around this beat's QRS centre left out of the activity and noise slopes, ms.</summary>
    public double NoiseExclusionMs { get; init; } = 120;

    /// <summary>
    /// Amplitude test of the onset: the onset moves in while the signal stays within this fraction of the QRS's
    /// peak-to-peak amplitude of the level before it (a slow tail is not QRS; the synthesiser's truth uses 2 %).
    /// </summary>
    public double AmplitudeOnFraction { get; init; } = 0.0125;

    /// <summary>The same amplitude test for the end, against the level after it.</summary>
    public double AmplitudeOffFraction { get; init; } = 0.02;

    /// <summary>Length of the stretch outside a boundary whose mean is the level of the amplitude test, ms.</summary>
    public double LevelMs { get; init; } = 16;

    /// <summary>A lead takes part in the multilead width only when its steepest slope reaches this fraction of the steepest lead's.</summary>
    public double MinLeadSlopeFraction { get; init; } = 0.35;

    /// <summary>A lead whose steepest slope is under this multiple of its noise slope never takes part (unless it is the clearest).</summary>
    public double LeadSnrFloor { get; init; } = 4;

    /// <summary>With three or more leads, a boundary further than this from the next lead's is an outlier and set aside, ms.</summary>
    public double LeadOutlierMs { get; init; } = 40;

    // --- P wave ----------------------------------------------------------------------------------------------------

    /// <summary>Corner of the zero-phase low-pass before P- and T-wave analysis, Hz.</summary>
    public double WaveLowPassHz { get; init; } = 15;

    /// <summary>Earliest start of the P window before the QRS onset, ms (it also starts after the previous T end).</summary>
    public double PWindowMs { get; init; } = 400;

    /// <summary>The P peak lies at most this long before the QRS onset, ms (PR up to about 0.3 s).</summary>
    public double PPeakEarliestMs { get; init; } = 330;

    /// <summary>The P peak lies at least this long before the QRS onset, ms.</summary>
    public double PPeakLatestMs { get; init; } = 35;

    /// <summary>A P window shorter than this is not judged, ms.</summary>
    public double PMinWindowMs { get; init; } = 120;

    /// <summary>Smallest P amplitude reported, mV.</summary>
    public double PMinAmplitudeMv { get; init; } = 0.02;

    /// <summary>Narrowest width of the P candidate at half its amplitude, ms.</summary>
    public double PMinHalfWidthMs { get; init; } = 16;

    /// <summary>Widest width of the P candidate at half its amplitude, ms (a guard; on the 15 Hz band P waves measure 60–130 ms).</summary>
    public double PMaxHalfWidthMs { get; init; } = 240;

    /// <summary>Isolation: the P amplitude over the RMS of the rest of the window.</summary>
    public double PRestRatio { get; init; } = 2;

    /// <summary>Isolation: the P amplitude over the largest other deflection in the window.</summary>
    public double PLargestOtherRatio { get; init; } = 1.2;

    /// <summary>Repetition: how many recent beats the candidate is compared with.</summary>
    public int PRepeatBeats { get; init; } = 8;

    /// <summary>Repetition: share of the recent beats whose candidate lay at the same distance before the QRS.</summary>
    public double PRepeatShare { get; init; } = 0.3;

    /// <summary>Repetition: two candidates lie at the same distance before the QRS when within this, ms.</summary>
    public double PRepeatToleranceMs { get; init; } = 20;

    /// <summary>Repetition: median correlation of the candidate's stretch with the same stretch of the recent beats.</summary>
    public double PRepeatCorrelation { get; init; } = 0.5;

    // --- T wave ----------------------------------------------------------------------------------------------------

    /// <summary>The T peak is searched from this long after the QRS end, ms.</summary>
    public double TStDelayMs { get; init; } = 100;

    /// <summary>The T end lies at most this long after the QRS end, ms.</summary>
    public double TMaxAfterQrsMs { get; init; } = 520;

    /// <summary>The T end lies at most this QTc (Bazett) after the QRS onset, s (QTc 0.52 s is long QT; from memory).</summary>
    public double TMaxQtcS { get; init; } = 0.52;

    /// <summary>The steepest point of the T's descending limb is searched up to this long after the T peak, ms.</summary>
    public double TDescentMs { get; init; } = 60;

    /// <summary>Reference point x_r of the trapezium rule: this long after the steepest descending point, ms.</summary>
    public double TReferenceMs { get; init; } = 100;

    /// <summary>Smallest T amplitude from which an end is taken, mV.</summary>
    public double TMinAmplitudeMv { get; init; } = 0.05;

    /// <summary>Another tall lead's later T end is taken when within this of the tallest lead's, ms.</summary>
    public double TLeadAgreementMs { get; init; } = 30;
}
