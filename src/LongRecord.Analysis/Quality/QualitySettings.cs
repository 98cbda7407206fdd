namespace LongRecord.Analysis.Quality;

/// <summary>
/// Thresholds of the signal-quality monitor. Windows are one second, judged on features of 100 ms blocks; noise is
/// judged over the two seconds centred on the window. Values marked "measured" were chosen by measuring MITDB (all 48
/// records, expert noise marks and beats), NSTDB 118e24…118e_6 and the synthesiser's truth; see
/// <c>src/LongRecord.Analysis/Quality/README.md</c> for the figures.
/// </summary>
public sealed record QualitySettings
{
    public static QualitySettings Default { get; } = new();

    /// <summary>Lower digital rail of each lead in mV (NaN or absent: unknown).</summary>
    public IReadOnlyList<double>? RailLowMv { get; init; }

    /// <summary>Upper digital rail of each lead in mV (NaN or absent: unknown).</summary>
    public IReadOnlyList<double>? RailHighMv { get; init; }

    /// <summary>A sample this close to a rail, held for a clipping plateau, counts as saturated (4 steps of MIT-BIH's 5 µV; common practice, no source).</summary>
    public double RailToleranceMv { get; init; } = 0.02;

    /// <summary>A lead is saturated in a window when this share of its samples sits on a rail or a clipping plateau (common practice, no source).</summary>
    public double SaturatedFraction { get; init; } = 0.3;

    /// <summary>
    /// A lead whose raw range over a whole window is at most this is flat. The smallest one-second range in MITDB
    /// (all 48 records, both leads, pauses of record 232 included) is 0.05 mV: measured, with a margin of 2.5.
    /// </summary>
    public double FlatRangeMv { get; init; } = 0.02;

    /// <summary>
    /// A sample repeated for this long counts as stuck. Runs of identical samples last at most 92 ms in MITDB (360 Hz)
    /// and 133 ms in SVDB (128 Hz) outside saturation: measured.
    /// </summary>
    public double StuckMinS { get; init; } = 0.2;

    /// <summary>
    /// A run of identical samples this long at the window's own maximum or minimum is a clipping plateau (a pointed R
    /// or S peak holds its value for a sample or two); common practice, no source.
    /// </summary>
    public double ClipPlateauMinS { get; init; } = 0.06;

    /// <summary>A lead is flat when this share of its window is stuck away from a rail (a step into lead-off).</summary>
    public double StuckFraction { get; init; } = 0.5;

    /// <summary>A lead is missing when this share of its window is NaN.</summary>
    public double MissingFraction { get; init; } = 0.5;

    /// <summary>
    /// Noisy when the quiet level of the QRS-band slope (25th percentile of the 100 ms block peaks) reaches this share
    /// of the lead's own QRS slope level; measured (alone it flags 3.9 % of MITDB lead-windows outside the experts'
    /// noise marks and 72 % of NSTDB 118e06's noise windows).
    /// </summary>
    public double NoisyIndex { get; init; } = 0.15;

    /// <summary>
    /// Noisy when the low-frequency activity (25th percentile of |Δ| between successive 100 ms block means) reaches
    /// this share of the lead's QRS amplitude; measured: clean synthetic lead II reaches 0.08 through its T and P waves.
    /// </summary>
    public double NoisyLowFrequencyIndex { get; init; } = 0.1;

    /// <summary>
    /// Noisy when the beat-to-beat residual outside the QRS (<c>BeatResidualTracker</c>) reaches this share of the
    /// lead's QRS amplitude: it sees slow electrode-motion bursts that the slope index misses; measured.
    /// </summary>
    public double NoisyResidualIndex { get; init; } = 0.1;

    /// <summary>
    /// A lead whose beat residual stays below this share of its QRS amplitude shows an organised rhythm: it is not
    /// unreadable, and the slope and low-frequency indices do not make it noisy (they misread fast, broad
    /// complexes as activity between beats). Measured: MITDB outside noise marks 0.02 median, NSTDB 118e12 noise 0.076,
    /// the synthesiser's broad-complex tachycardia at 170/min 0.01–0.04.
    /// </summary>
    public double OrganisedResidualIndex { get; init; } = 0.05;

    /// <summary>
    /// Chaotic is ruled out when every signal lead shows repeating complexes — a beat residual below this share of its
    /// QRS amplitude — and is not a pure sinusoid (leakage at least <see cref="SinusoidLeakage"/>): supraventricular and
    /// ventricular tachycardia stay analysable. Measured: SVDB 865's tachycardia at 147/min 0.025–0.096, MITDB 207's
    /// flutter stretches 0.093 at the 25th percentile.
    /// </summary>
    public double ChaoticOrganisedResidualIndex { get; init; } = 0.08;

    /// <summary>
    /// Leakage below this reads as ventricular flutter even when it repeats beat after beat: the decision threshold of
    /// Kuo and Dillman's VF filter as Amann et al. 2005 give it (0.406, from memory). Measured: synthetic flutter
    /// 0.15–0.21, MITDB 207's regular flutter at 252–259 s 0.32–0.40 on its lower lead; the organised tachycardias of
    /// SVDB 861 and 865 (lower lead 0.53 and above) and MITDB's other records stay above it.
    /// </summary>
    public double SinusoidLeakage { get; init; } = 0.406;

    /// <summary>
    /// Unreadable candidate when the slope index reaches this: the level at which MITDB's expert-annotated beats in
    /// excluded windows stay below 0.1 % (with <see cref="UnreadableMinWindows"/>); measured on MITDB and NSTDB.
    /// </summary>
    public double UnreadableIndex { get; init; } = 0.25;

    /// <summary>Unreadable candidate when the low-frequency index reaches this; measured.</summary>
    public double UnreadableLowFrequencyIndex { get; init; } = 0.12;

    /// <summary>A lead is unreadable only inside a run of at least this many candidate windows (morphological opening).</summary>
    public int UnreadableMinWindows { get; init; } = 5;

    /// <summary>Chaotic needs every signal lead's quiet-to-peak slope ratio at least this (no QRS standing out); measured.</summary>
    public double ChaoticPeakRatio { get; init; } = 0.2;

    /// <summary>
    /// Chaotic needs one lead whose narrow-band leakage (after Kuo and Dillman's VF filter, 1978, as described by Amann
    /// et al. 2005 — from memory) is below this; their own threshold is 0.406. Measured: MITDB 207's flutter stretches
    /// against NSTDB noise, whose leakage never fell below 0.74.
    /// </summary>
    public double ChaoticLeakage { get; init; } = 0.65;

    /// <summary>Mean frequency band of ventricular fibrillation and flutter, Hz (3–10 Hz dominant frequency, from memory; widened to 2 Hz).</summary>
    public double ChaoticMinHz { get; init; } = 2;

    /// <summary>Upper end of the fibrillation band, Hz.</summary>
    public double ChaoticMaxHz { get; init; } = 10;

    /// <summary>The narrow-band lead must swing at least this share of the lead's QRS amplitude (MITDB 207: 0.48 at the 1st percentile).</summary>
    public double ChaoticMinAmplitude { get; init; } = 0.25;

    /// <summary>Chaotic windows form runs of at least this many (opening), and gaps shorter than this are closed.</summary>
    public int ChaoticMinWindows { get; init; } = 3;

    /// <summary>A run of noise windows this long or shorter that touches a chaotic run becomes chaotic (<c>ChaoticBridge</c>).</summary>
    public int ChaoticBridgeWindows { get; init; } = 10;

    /// <summary>Only windows whose quiet-to-peak ratio is below this update the lead's QRS reference.</summary>
    public double ReferenceGateRatio { get; init; } = 0.12;

    /// <summary>The QRS reference is the median of this many recent qualifying windows.</summary>
    public int ReferenceWindows { get; init; } = 60;

    /// <summary>Throws when a value is out of range; every problem is listed at once.</summary>
    public void Validate(int leads)
    {
        var problems = new List<string>();
        void Positive(double v, string name)
        {
            if (!(v > 0) || double.IsInfinity(v))
            {
                problems.Add($"{name} must be positive and finite (is {v})");
            }
        }

        void Fraction(double v, string name)
        {
            if (!(v > 0 && v <= 1))
            {
                problems.Add($"{name} must be in (0, 1] (is {v})");
            }
        }

        Positive(RailToleranceMv, nameof(RailToleranceMv));
        Positive(FlatRangeMv, nameof(FlatRangeMv));
        Positive(StuckMinS, nameof(StuckMinS));
        Positive(ClipPlateauMinS, nameof(ClipPlateauMinS));
        if (ClipPlateauMinS > StuckMinS)
        {
            problems.Add($"{nameof(ClipPlateauMinS)} must not exceed {nameof(StuckMinS)} (is {ClipPlateauMinS})");
        }

        Fraction(SaturatedFraction, nameof(SaturatedFraction));
        Fraction(StuckFraction, nameof(StuckFraction));
        Fraction(MissingFraction, nameof(MissingFraction));
        Fraction(ChaoticPeakRatio, nameof(ChaoticPeakRatio));
        Fraction(ChaoticLeakage, nameof(ChaoticLeakage));
        Fraction(ReferenceGateRatio, nameof(ReferenceGateRatio));
        Positive(NoisyIndex, nameof(NoisyIndex));
        Positive(NoisyLowFrequencyIndex, nameof(NoisyLowFrequencyIndex));
        Positive(NoisyResidualIndex, nameof(NoisyResidualIndex));
        Positive(OrganisedResidualIndex, nameof(OrganisedResidualIndex));
        Positive(ChaoticOrganisedResidualIndex, nameof(ChaoticOrganisedResidualIndex));
        Fraction(SinusoidLeakage, nameof(SinusoidLeakage));
        Positive(ChaoticMinAmplitude, nameof(ChaoticMinAmplitude));
        if (UnreadableIndex < NoisyIndex)
        {
            problems.Add($"{nameof(UnreadableIndex)} must be at least {nameof(NoisyIndex)} (is {UnreadableIndex})");
        }

        if (UnreadableLowFrequencyIndex < NoisyLowFrequencyIndex)
        {
            problems.Add($"{nameof(UnreadableLowFrequencyIndex)} must be at least {nameof(NoisyLowFrequencyIndex)} (is {UnreadableLowFrequencyIndex})");
        }

        if (!(ChaoticMinHz > 0 && ChaoticMaxHz > ChaoticMinHz))
        {
            problems.Add($"the chaotic band must satisfy 0 < {nameof(ChaoticMinHz)} < {nameof(ChaoticMaxHz)} (is {ChaoticMinHz}–{ChaoticMaxHz})");
        }

        if (UnreadableMinWindows is < 1 or > WindowDecisions.MaxRunWindows || UnreadableMinWindows % 2 == 0)
        {
            problems.Add($"{nameof(UnreadableMinWindows)} must be odd, 1 to {WindowDecisions.MaxRunWindows} (is {UnreadableMinWindows})");
        }

        if (ChaoticMinWindows is < 1 or > WindowDecisions.MaxRunWindows || ChaoticMinWindows % 2 == 0)
        {
            problems.Add($"{nameof(ChaoticMinWindows)} must be odd, 1 to {WindowDecisions.MaxRunWindows} (is {ChaoticMinWindows})");
        }

        if (ChaoticBridgeWindows is < 0 or > 120)
        {
            problems.Add($"{nameof(ChaoticBridgeWindows)} must be 0 to 120 (is {ChaoticBridgeWindows})");
        }

        if (ReferenceWindows is < 1 or > 600)
        {
            problems.Add($"{nameof(ReferenceWindows)} must be 1 to 600 (is {ReferenceWindows})");
        }

        if (RailLowMv is not null && RailLowMv.Count != leads)
        {
            problems.Add($"{nameof(RailLowMv)} has {RailLowMv.Count} values for {leads} leads");
        }

        if (RailHighMv is not null && RailHighMv.Count != leads)
        {
            problems.Add($"{nameof(RailHighMv)} has {RailHighMv.Count} values for {leads} leads");
        }

        if (problems.Count > 0)
        {
            throw new ArgumentException($"{problems.Count} problem(s) in the quality settings: {string.Join("; ", problems)}", "settings");
        }
    }
}
