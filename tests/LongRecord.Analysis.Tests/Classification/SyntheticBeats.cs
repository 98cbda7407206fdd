namespace LongRecord.Analysis.Tests.Classification;

/// <summary>
/// A two-lead synthetic recording built from Gaussian waves, for worked examples of the textbook beat types: a sinus
/// beat (upright P 160 ms before a narrow QRS), a premature atrial beat (inverted, earlier P, same QRS) and a
/// premature ventricular beat (no P, broad QRS, discordant T).
/// </summary>
internal static class SyntheticBeats
{
    public enum Kind { Sinus, Atrial, Ventricular }

    public const double Fs = 250;

    public static float[][] Render(IReadOnlyList<(double TimeS, Kind Kind)> beats, double lengthS)
    {
        var n = (int)(lengthS * Fs);
        var leads = new[] { new float[n], new float[n] };
        var noise = new Random(7);
        for (var i = 0; i < n; i++)
        {
            leads[0][i] = (float)(0.005 * (noise.NextDouble() - 0.5));
            leads[1][i] = (float)(0.005 * (noise.NextDouble() - 0.5));
        }

        foreach (var (t, kind) in beats)
        {
            foreach (var (at, amp, width, lead2) in Waves(kind))
            {
                var centre = t + at;
                var from = Math.Max(0, (int)((centre - 4 * width) * Fs));
                var to = Math.Min(n - 1, (int)((centre + 4 * width) * Fs));
                for (var i = from; i <= to; i++)
                {
                    var x = (i / Fs - centre) / width;
                    var g = Math.Exp(-0.5 * x * x);
                    leads[0][i] += (float)(amp * g);
                    leads[1][i] += (float)(lead2 * amp * g);
                }
            }
        }

        return leads;
    }

    // (offset from the QRS s, amplitude mV, Gaussian width s, lead-2 factor)
    private static (double, double, double, double)[] Waves(Kind kind) => kind switch
    {
        Kind.Sinus =>
        [
            (-0.160, 0.15, 0.020, 0.8), (0, 1.0, 0.010, 0.6), (0.025, -0.25, 0.008, 1.0), (0.250, 0.30, 0.040, 0.7),
        ],
        Kind.Atrial =>
        [
            (-0.120, -0.15, 0.015, 0.8), (0, 1.0, 0.010, 0.6), (0.025, -0.25, 0.008, 1.0), (0.250, 0.30, 0.040, 0.7),
        ],
        _ =>
        [
            (-0.020, 1.0, 0.025, -0.5), (0.045, -0.8, 0.030, -0.5), (0.300, -0.40, 0.050, -0.5),
        ],
    };
}
