namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>
/// Settings of <see cref="BeatDelineator"/>, all in milliseconds, hertz or ratios so that one set serves every sampling
/// rate. Defaults were fitted on the development records of the QT Database (qtdb, 53 of 105 records) and checked on
/// MIT-BIH and on the synthesiser's truth; the others are kept back for independent evaluation.
/// </summary>
public sealed record DelineationSettings
{
    public static DelineationSettings Default { get; } = new();

    /// <summary>Corner of the zero-phase low-pass applied before the QRS derivative, Hz.</summary>
    public double QrsLowPassHz { get; init; } = 25;

    /// <summary>Corner of the lighter zero-phase low-pass on which the QRS boundaries themselves are walked, Hz.</summary>
    public double QrsFineLowPassHz { get; init; } = 60;

    /// <summary>Corner of the zero-phase low-pass applied before P- and T-wave analysis, Hz.</summary>
    public double WaveLowPassHz { get; init; } = 15;

    /// <summary>How far from the caller's fiducial the QRS centre may lie, ms.</summary>
    public double QrsLocateMs { get; init; } = 150;

    /// <summary>Half-width of the search for the QRS's largest slope around its centre, ms.</summary>
    public double QrsPeakSearchMs { get; init; } = 90;

    /// <summary>Furthest a QRS boundary may lie from the QRS centre, ms.</summary>
    public double QrsMaxHalfMs { get; init; } = 180;

    /// <summary>A slope peak counts as a QRS wave when it reaches this fraction of the QRS's largest slope.</summary>
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

    /// <summary>Slope below this fraction of the largest slope counts as quiet (between QRS waves and the next wave).</summary>
    public double QuietSlopeFraction { get; init; } = 0.1;

    /// <summary>A quiet stretch this long ends the QRS (what lies beyond is another wave), ms.</summary>
    public double QuietGapMs { get; init; } = 40;

    /// <summary>An opposite limb this short between two significant limbs is a notch inside the QRS, ms.</summary>
    public double NotchMs { get; init; } = 2;

    /// <summary>K_on of Laguna et al.: the onset is where the slope falls below the first wave's peak slope ÷ K_on.</summary>
    public double OnsetDivisor { get; init; } = 12;

    /// <summary>K_end of Laguna et al. for the QRS end (J point).</summary>
    public double OffsetDivisor { get; init; } = 11;

    public double SustainMs { get; init; } = 18;

    public double AmplitudeOnFraction { get; init; } = 0.0125;

    public double AmplitudeOffFraction { get; init; } = 0.02;

    public double LevelMs { get; init; } = 16;

    public double TailMs { get; init; }

    public double TailFraction { get; init; } = 0.02;

    public double TailReverseFraction { get; init; } = 0.01;

    public double GlobalOnFraction { get; init; } = 0.015;

    public double GlobalOffFraction { get; init; } = 0.12;

    public double NoiseMeanScale { get; init; } = 1.6;

    public double NoiseExclusionMs { get; init; } = 120;

    /// <summary>Boundary thresholds never go below this multiple of the lead's noise slope.</summary>
    public double NoiseSlopeMultiple { get; init; } = 1;

    /// <summary>
    /// A lead's QRS takes part in the multilead width only when its peak slope reaches this fraction of the steepest
    /// lead's (a tiny QRS gives unreliable boundaries).
    /// </summary>
    public double MinLeadSlopeFraction { get; init; } = 0.35;

    public double MinLeadSnr { get; init; } = 1e9;

    /// <summary>
    /// A lead whose QRS peak slope is below this multiple of its noise slope never takes part (unless it is the only
    /// lead with boundaries).
    /// </summary>
    public double LeadSnrFloor { get; init; } = 4;

    /// <summary>A lead's boundary further than this from the other leads' is an outlier and set aside, ms.</summary>
    public double LeadOutlierMs { get; init; } = 40;

    /// <summary>Earliest start of the P-wave window before the QRS onset, ms (it never starts before the previous T end).</summary>
    public double PWindowMs { get; init; } = 400;

    /// <summary>The P peak lies at most this long before the QRS onset, ms (PR up to ~0.3 s).</summary>
    public double PPeakEarliestMs { get; init; } = 330;

    /// <summary>The P peak lies at least this long before the QRS onset, ms.</summary>
    public double PPeakLatestMs { get; init; } = 35;

    /// <summary>A P window shorter than this is not judged (the P wave may be hidden in the T wave), ms.</summary>
    public double PMinWindowMs { get; init; } = 120;

    /// <summary>Smallest P amplitude reported, mV.</summary>
    public double PMinAmplitudeMv { get; init; } = 0.02;

    /// <summary>Plausible width of the P wave at half its amplitude, ms (P duration about 60–120 ms).</summary>
    public double PMinHalfWidthMs { get; init; } = 16;

    /// <summary>See <see cref="PMinHalfWidthMs"/>.</summary>
    public double PMaxHalfWidthMs { get; init; } = 240;

    /// <summary>P amplitude ÷ RMS activity of the rest of the window needed with no template support.</summary>
    public double PStrictRatio { get; init; } = 2;

    /// <summary>The activity around a P candidate is measured from this long before it to the QRS onset, ms.</summary>
    public double PRestBeforeMs { get; init; } = 1000;

    /// <summary>P amplitude ÷ the largest other deflection in the window.</summary>
    public double PPeakRatio { get; init; } = 1.2;

    /// <summary>Median correlation with the same stretch of the recent beats that counts as a repeating wave.</summary>
    public double PTemplateCorrelation { get; init; } = 0.5;

    /// <summary>Share of the recent beats with the candidate at the same distance before the QRS (within <see cref="PPrToleranceMs"/>).</summary>
    public double PPrAgreement { get; init; } = 0.3;

    /// <summary>How many recent beats the P-wave repetition tests compare with.</summary>
    public int PHistoryBeats { get; init; } = 8;

    /// <summary>Two candidates lie at the same distance before the QRS when within this of each other, ms.</summary>
    public double PPrToleranceMs { get; init; } = 20;

    /// <summary>The T peak is searched from this long after the QRS end, ms.</summary>
    public double TStDelayMs { get; init; } = 100;

    /// <summary>The T end lies at most this long after the QRS end, ms.</summary>
    public double TMaxAfterQrsMs { get; init; } = 520;

    /// <summary>The steepest point of the T's descending limb is searched up to this long after the T peak, ms.</summary>
    public double TDescentMs { get; init; } = 60;

    /// <summary>Reference point x_r of the trapezium rule: this long after the steepest descending point, ms.</summary>
    public double TReferenceMs { get; init; } = 100;

    /// <summary>Longest QTc (Bazett) the T-end search allows, s.</summary>
    public double TMaxQtcS { get; init; } = 0.52;

    /// <summary>Another lead's later T end is taken when within this of the tallest lead's, ms.</summary>
    public double TLeadAgreementMs { get; init; } = 30;

    /// <summary>Smallest T amplitude from which an end is taken, mV.</summary>
    public double TMinAmplitudeMv { get; init; } = 0.05;
}
