using LongRecord.Synthesis.Randomness;
using LongRecord.Synthesis.Scenarios;

namespace LongRecord.Synthesis.Timeline;

/// <summary>
/// Sinus RR as a function of time (all values ours, chosen to resemble resting Holter data):
/// the rate follows clock time (day and night rates with logistic transitions of about half an hour at the wake and
/// sleep times), a very-low-frequency activity drift (±3 %, 90 s knots), respiratory sinus arrhythmia at the
/// respiration rate (3.5 % of RR at rest, shrinking as (70 / HR)² above 70 bpm), a Mayer-wave component near 0.1 Hz
/// (2 %, wandering phase) and a white beat-to-beat component (0.6 %). Together these give a resting RR coefficient of
/// variation near 0.03–0.05.
/// </summary>
internal sealed class SinusRateModel(DateTime start, CircadianSettings circadian, ulong seed)
{
    public const double RespirationHz = 0.25;
    public const double MayerHz = 0.1;

    private const ulong VlfStream = 11;
    private const ulong MayerPhaseStream = 12;
    private readonly double _wakeH = circadian.WakeTime.ToTimeSpan().TotalHours;
    private readonly double _sleepH = circadian.SleepTime.ToTimeSpan().TotalHours;
    private readonly double _respPhase = 2 * Math.PI * CounterRandom.Uniform(seed, 13, 0);

    /// <summary>Circadian sinus rate at elapsed time <paramref name="tS"/>, bpm.</summary>
    public double CircadianRateBpm(double tS)
    {
        var h = (start.TimeOfDay.TotalHours + tS / 3600.0) % 24.0;
        var day = Logistic(Wrap(h - _wakeH) / 0.35) * Logistic(Wrap(_sleepH - h) / 0.35);
        return circadian.NightRateBpm + (circadian.DayRateBpm - circadian.NightRateBpm) * day;
    }

    /// <summary>Next sinus RR, seconds, for a mean rate <paramref name="rateBpm"/> at time <paramref name="tS"/>.</summary>
    public double NextRrS(double tS, double rateBpm, SequentialRandom rng, bool withDrift = true)
    {
        var rr = 60.0 / rateBpm;
        var rest = Math.Min(1.0, 70.0 / rateBpm);
        var drift = withDrift ? 0.03 * ValueNoise.At(seed, VlfStream, tS / 90.0) : 0.0;
        var rsa = 0.035 * rest * rest * Math.Sin(2 * Math.PI * RespirationHz * tS + _respPhase);
        var mayerPhase = 1.5 * ValueNoise.At(seed, MayerPhaseStream, tS / 40.0);
        var mayer = 0.02 * rest * Math.Sin(2 * Math.PI * MayerHz * tS + mayerPhase);
        var white = 0.006 * rng.NextGaussian();
        return rr * (1 + drift) * (1 + rsa + mayer + white);
    }

    /// <summary>Respiratory modulation of QRS amplitude (±6 %), in phase with RSA (ours).</summary>
    public double RespiratoryAmplitude(double tS) => 1.0 + 0.06 * Math.Sin(2 * Math.PI * RespirationHz * tS + _respPhase + 0.8);

    private static double Wrap(double h) => h >= 12 ? h - 24 : h < -12 ? h + 24 : h;

    private static double Logistic(double x) => 1.0 / (1.0 + Math.Exp(-x));
}
