using LongRecord.Synthesis.Randomness;

namespace LongRecord.Synthesis.Rendering;

/// <summary>One electrode-motion artefact: a baseline step with recovery, a low-frequency burst, or a QRS-like spike.</summary>
internal readonly record struct MotionEvent(byte Kind, double T0S, double Amplitude, double A, double B, double FromS, double ToS, double W0, double W1, double W2)
{
    public const byte Step = 0;
    public const byte Burst = 1;
    public const byte Spike = 2;

    public double Value(double t)
    {
        var x = t - T0S;
        switch (Kind)
        {
            case Step:
                // Fast 20 ms rise, exponential recovery with time constant A.
                return x < 0 ? 0 : Amplitude * (1 - Math.Exp(-x / 0.02)) * Math.Exp(-x / A);
            case Burst:
                // Gaussian-windowed oscillation of A Hz, window width B s.
                return Amplitude * Math.Sin(2 * Math.PI * A * x) * Math.Exp(-0.5 * x * x / (B * B));
            default:
                // Biphasic derivative-of-Gaussian spike of width A s (QRS-like transient).
                var u = x / A;
                return Amplitude * 1.6487 * u * Math.Exp(-0.5 * u * u);
        }
    }

    public double Weight(int lead) => lead == 0 ? W0 : lead == 1 ? W1 : W2;
}

/// <summary>
/// Electrode-motion noise in the manner of the MIT-BIH noise stress test's "em" record: low-frequency bursts, baseline
/// steps with slow recovery and sharp QRS-like transients, over a slow drift. Event rates and sizes are ours. The
/// events of a stretch are drawn once when the recording is built; rendering sums those that reach each sample.
/// </summary>
internal static class ElectrodeMotion
{
    /// <summary>Longest reach of an event before its time origin (bursts) and after it (step recovery).</summary>
    public const double MaxReachBeforeS = 2.5;

    public static MotionEvent[] Draw(ulong seed, double startS, double endS)
    {
        var rng = new SequentialRandom(seed);
        var list = new List<MotionEvent>();
        Poisson(rng, startS, endS, 0.3, list, (t, r) =>
        {
            var tau = r.Uniform(0.3, 1.2);
            return Make(MotionEvent.Step, t, r.NextGaussian(), tau, 0, t, t + 7 * tau, r);
        });
        Poisson(rng, startS, endS, 0.35, list, (t, r) =>
        {
            var width = r.Uniform(0.15, 0.5);
            return Make(MotionEvent.Burst, t, 0.8 * r.NextGaussian(), r.Uniform(0.7, 4.0), width, t - 4 * width, t + 4 * width, r);
        });
        Poisson(rng, startS, endS, 0.5, list, (t, r) =>
        {
            var width = r.Uniform(0.008, 0.02);
            return Make(MotionEvent.Spike, t, 0.9 * r.NextGaussian(), width, 0, t - 5 * width, t + 5 * width, r);
        });
        list.Sort((a, b) => a.FromS.CompareTo(b.FromS));
        return [.. list];
    }

    private static MotionEvent Make(byte kind, double t, double amplitude, double a, double b, double from, double to, SequentialRandom r) =>
        new(kind, t, amplitude, a, b, from, to, 1.0, r.Uniform(0.4, 1.0) * (r.NextDouble() < 0.5 ? -1 : 1), r.Uniform(0.4, 1.0) * (r.NextDouble() < 0.5 ? -1 : 1));

    private static void Poisson(SequentialRandom rng, double startS, double endS, double ratePerS, List<MotionEvent> list, Func<double, SequentialRandom, MotionEvent> make)
    {
        for (var t = startS - Math.Log(1 - rng.NextDouble()) / ratePerS; t < endS; t -= Math.Log(1 - rng.NextDouble()) / ratePerS)
        {
            list.Add(make(t, rng));
        }
    }
}
