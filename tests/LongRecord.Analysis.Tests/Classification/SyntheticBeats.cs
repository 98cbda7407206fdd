using LongRecord.Analysis.Beats.Classification;

namespace LongRecord.Analysis.Tests.Classification;

/// <summary>
/// A two-lead synthetic recording built from Gaussian waves, for worked examples of the textbook beat types: a sinus
/// beat (upright P 160 ms before a narrow QRS), a premature atrial beat (inverted, earlier P, same QRS) and a
/// premature ventricular beat (no P, broad QRS, discordant T), and a beat conducted in atrial fibrillation (no P,
/// same QRS), with fibrillatory waves (a small irregular 4–9 Hz oscillation) over a chosen stretch; and, for a
/// bundle-branch block, a sinus beat with a broad notched QRS and discordant T, and a ventricular beat narrower than it.
/// </summary>
internal static class SyntheticBeats
{
    public enum Kind { Sinus, Atrial, Ventricular, Conducted, SinusBlocked, VentricularNarrow }

    public const double Fs = 250;

    /// <summary>
    /// Renders <paramref name="beats"/> and classifies each from its two-lead window (0.5 s before to 0.7 s after the R),
    /// as the beats stage hands windows over, with the measurements <paramref name="measure"/> gives beat by beat
    /// (index, kind); every beat is returned, in order.
    /// </summary>
    public static List<ClassifiedBeat> Classify(IReadOnlyList<(double TimeS, Kind Kind)> beats, double lengthS,
        Func<int, Kind, BeatMeasurements>? measure = null, double fibrillationFromS = 0, double fibrillationToS = 0)
    {
        var leads = Render(beats, lengthS, fibrillationFromS, fibrillationToS);
        var c = new BeatClassifier(Fs, 2);
        var output = new List<ClassifiedBeat>();
        for (var i = 0; i < beats.Count; i++)
        {
            var (time, kind) = beats[i];
            Add(c, leads, (long)Math.Round(time * Fs), measure?.Invoke(i, kind) ?? BeatMeasurements.Unknown);
            while (c.TryTake(out var b))
            {
                output.Add(b);
            }
        }

        c.Flush();
        while (c.TryTake(out var b))
        {
            output.Add(b);
        }

        return output;
    }

    /// <summary>Hands the classifier the beat at <paramref name="fiducial"/>: its two-lead window, 0.5 s before to 0.7 s after.</summary>
    public static void Add(BeatClassifier c, float[][] leads, long fiducial, BeatMeasurements measurements)
    {
        var before = (int)(0.5 * Fs);
        var after = (int)(0.7 * Fs);
        var from = (int)Math.Max(0, fiducial - before);
        var to = (int)Math.Min(leads[0].Length - 1, fiducial + after);
        var length = to - from + 1;
        var window = new float[2 * length];
        leads[0].AsSpan(from, length).CopyTo(window);
        leads[1].AsSpan(from, length).CopyTo(window.AsSpan(length));
        c.Add(fiducial, window, length, (int)(fiducial - from), measurements);
    }

    public static float[][] Render(IReadOnlyList<(double TimeS, Kind Kind)> beats, double lengthS, double fibrillationFromS = 0, double fibrillationToS = 0)
    {
        var n = (int)(lengthS * Fs);
        var leads = new[] { new float[n], new float[n] };
        var noise = new Random(7);
        for (var i = 0; i < n; i++)
        {
            leads[0][i] = (float)(0.005 * (noise.NextDouble() - 0.5));
            leads[1][i] = (float)(0.005 * (noise.NextDouble() - 0.5));
        }

        // Fibrillatory waves: a few incommensurate 4–9 Hz components whose phases wander, about 0.05 mV
        // (f waves are 0.05–0.1 mV at 350–600 /min; textbook, from memory).
        var phases = new double[] { 0.3, 1.9, 4.1 };
        double[] hz = [4.7, 6.3, 8.1];
        for (var i = (int)(fibrillationFromS * Fs); i < Math.Min(n, (int)(fibrillationToS * Fs)); i++)
        {
            double f = 0;
            for (var k = 0; k < hz.Length; k++)
            {
                phases[k] += 2 * Math.PI * hz[k] / Fs + 0.05 * (noise.NextDouble() - 0.5);
                f += Math.Sin(phases[k]);
            }

            leads[0][i] += (float)(0.02 * f);
            leads[1][i] += (float)(0.015 * f);
        }

        for (var b = 0; b < beats.Count; b++)
        {
            var (t, kind) = beats[b];

            // Repolarisation shortens with the cycle before the beat (QT in proportion to √RR, Bazett 1920): the T
            // wave, 250 ms after the QRS at 800 ms, comes earlier after a short cycle.
            var rrS = b > 0 ? t - beats[b - 1].TimeS : 0.8;
            var tScale = Math.Sqrt(Math.Clamp(rrS, 0.3, 2.0) / 0.8);
            foreach (var (at, amp, width, lead2) in Waves(kind))
            {
                var centre = t + (at >= 0.2 ? at * tScale : at);
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
        Kind.Conducted =>
        [
            (0, 1.0, 0.010, 0.6), (0.025, -0.25, 0.008, 1.0), (0.250, 0.30, 0.040, 0.7),
        ],
        Kind.Atrial =>
        [
            (-0.120, -0.15, 0.015, 0.8), (0, 1.0, 0.010, 0.6), (0.025, -0.25, 0.008, 1.0), (0.250, 0.30, 0.040, 0.7),
        ],
        Kind.SinusBlocked =>
        [
            (-0.200, 0.15, 0.020, 0.8), (-0.025, 0.7, 0.018, 0.6), (0.035, 0.8, 0.018, 0.6), (0.300, -0.30, 0.050, 0.7),
        ],
        Kind.VentricularNarrow =>
        [
            (0, -0.9, 0.010, 0.8), (0.030, 0.5, 0.010, -0.5), (0.280, 0.45, 0.045, -0.5),
        ],
        _ =>
        [
            (-0.020, 1.0, 0.025, -0.5), (0.045, -0.8, 0.030, -0.5), (0.300, -0.40, 0.050, -0.5),
        ],
    };
}
