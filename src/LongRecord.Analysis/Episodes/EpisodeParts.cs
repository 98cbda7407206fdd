namespace LongRecord.Analysis.Episodes;

/// <summary>QRS width of an episode's complexes.</summary>
public enum QrsWidth
{
    /// <summary>Not measured: beats without a signal, or too few widths.</summary>
    Unknown,

    /// <summary>Below the broad threshold (120 ms by default).</summary>
    Narrow,

    /// <summary>At or above the broad threshold: may be ventricular, flagged urgent.</summary>
    Broad,
}

/// <summary>How an episode began, measured on its RR intervals.</summary>
/// <param name="Type"><c>abrupt</c>, <c>gradual</c> or <c>not-observed</c> (the episode was under way where analysable signal begins).</param>
/// <param name="Ratio">First RR of the episode ÷ mean of the four RR before it (after Swerdlow et al. 1994); NaN when not observed.</param>
/// <param name="Trigger"><c>premature-atrial</c>, <c>premature-ventricular</c>, <c>premature</c> (by RR only) or <c>none</c>.</param>
/// <param name="WarmUpS">Seconds from the first beat until the RR settles within the steady fraction of the episode's median RR.</param>
public sealed record OnsetMeasure(string Type, double Ratio, string Trigger, double WarmUpS);

/// <summary>How an episode ended, measured on its RR intervals.</summary>
/// <param name="Type"><c>abrupt</c>, <c>gradual</c> or <c>not-observed</c>.</param>
/// <param name="Ratio">First RR after the episode ÷ mean of its last four RR; NaN when not observed.</param>
/// <param name="CoolDownS">Seconds from the last steady beat to the last beat.</param>
/// <param name="Termination"><c>abrupt</c>, <c>abrupt-with-pause</c>, <c>gradual</c> or <c>not-observed</c>.</param>
/// <param name="PauseAfterS">The RR after the last beat when it is a post-termination pause, else NaN.</param>
public sealed record OffsetMeasure(string Type, double Ratio, double CoolDownS, string Termination, double PauseAfterS);

/// <summary>What the signal showed of atrial activity during a narrow or irregular episode.</summary>
public sealed record AtrialFinding
{
    /// <summary>Nothing measured (no signal, or not an episode that needs it).</summary>
    public static AtrialFinding NotMeasured { get; } = new() { Finding = "not-measured" };

    /// <summary>
    /// <c>flutter-waves</c> (RR at multiples of the cycle of a sharp spectral peak), <c>flutter-waves-locked</c> (at n times a regular ventricular rate), <c>fibrillatory-waves</c>, <c>p-waves</c> (a P before the QRS),
    /// <c>p-after-qrs</c> (none before: absent, buried in or just after the QRS), <c>unclear</c> or <c>not-measured</c>.
    /// </summary>
    public required string Finding { get; init; }

    /// <summary>Share of the episode's beats with a P wave in the PR window (from the beats stage); NaN when not judged.</summary>
    public double PBeforeShare { get; init; } = double.NaN;

    /// <summary>
    /// How often P waves are found here against clean sinus beats (see <c>AtrialActivity.PFoundFactor</c>), 0.5–1: the
    /// P-wave share thresholds are scaled by it; 1 when not measured or when the beats before were no sinus reference.
    /// </summary>
    public double PFoundFactor { get; init; } = 1;

    /// <summary>Share of the sinus beats before the episode with a P wave found, among those judged; NaN when too few.</summary>
    public double SinusPShare { get; init; } = double.NaN;

    /// <summary>Distinct P shapes among the beats with a P wave; 0 when not measured.</summary>
    public int PShapes { get; init; }

    /// <summary>Share of the P waves in the largest of those shape groups; NaN when not measured.</summary>
    public double DominantPShare { get; init; } = double.NaN;

    /// <summary>Correlation of the episode's mean P wave with the sinus P wave before it (leads together); NaN when either is missing.</summary>
    public double SinusPCorrelation { get; init; } = double.NaN;

    /// <summary>Atrial rate from the spectrum of atrial activity (or twice the ventricular rate for 2:1), per minute; NaN when none.</summary>
    public double AtrialRateBpm { get; init; } = double.NaN;

    /// <summary>Share of 3–12 Hz atrial power within ± 0.3 Hz of the peak (sharpness).</summary>
    public double PeakShare { get; init; } = double.NaN;

    /// <summary>Share of 3–12 Hz atrial power in the 4–9 Hz band (fibrillatory waves).</summary>
    public double BandShare { get; init; } = double.NaN;

    /// <summary>Locked-wave index of a regular rhythm (see <c>LockedAtrialWaves</c>): near 1 when atrial waves repeat n times per cycle.</summary>
    public double LockedWaveIndex { get; init; } = double.NaN;

    /// <summary>Share of RR intervals at whole multiples of the flutter cycle.</summary>
    public double ClusterShare { get; init; } = double.NaN;

    /// <summary>QRS width of the episode's mean complex measured on the signal, ms; NaN when not measured.</summary>
    public double MeanComplexQrsMs { get; init; } = double.NaN;
}

/// <summary>A stretch of signal to show the reviewer, seconds from the first sample.</summary>
public readonly record struct Strip(double StartS, double EndS);
