using LongRecord.Analysis.Beats;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// P-wave shapes on the signal: for each beat the beats stage found a P wave in, the conditioned leads ± 60 ms
/// around the P peak (P waves last up to about 120 ms: common practice), smoothed by a 20 ms moving average applied
/// twice (P waves are slow; muscle noise is not) and with the straight line between the window's ends removed (the
/// descending T wave of the previous beat at fast rates). Shapes are compared by the cosine of the angle between these
/// vectors (leads together) and by their size.
/// </summary>
internal static class PWaveShapes
{
    private const double HalfWindowS = 0.06;
    private const double SmoothS = 0.01;

    /// <summary>The P vector of <paramref name="beat"/>, or null when it has no P wave or the window is incomplete.</summary>
    public static float[]? Vector(SignalWindow w, in Beat beat)
    {
        if (beat.PWave != 1 || beat.PPeakOffset == Beat.Unknown)
        {
            return null;
        }

        var half = (int)Math.Round(HalfWindowS * w.RateHz);
        var k = Math.Max(1, (int)Math.Round(SmoothS * w.RateHz));
        var centre = beat.Sample + beat.PPeakOffset;
        if (!w.Holds(centre - half - 2 * k, centre + half + 2 * k))
        {
            return null;
        }

        var n = 2 * half + 1;
        var vector = new float[n * w.Leads];
        var raw = new float[n + 4 * k];
        var once = new float[n + 2 * k];
        for (var lead = 0; lead < w.Leads; lead++)
        {
            var x = w.Lead(lead);
            var from = w.At(centre - half - 2 * k);
            for (var i = 0; i < raw.Length; i++)
            {
                raw[i] = x[from + i];
                if (float.IsNaN(raw[i]))
                {
                    return null;
                }
            }

            Box(raw, once, k);
            var smoothed = vector.AsSpan(lead * n, n);
            Box(once, smoothed, k);
            Detrend(smoothed);
        }

        return vector;
    }

    /// <summary>Cosine of the angle between two P vectors; NaN when either is flat.</summary>
    public static double Similarity(ReadOnlySpan<float> a, ReadOnlySpan<float> b)
    {
        double ab = 0, aa = 0, bb = 0;
        for (var i = 0; i < a.Length; i++)
        {
            ab += a[i] * b[i];
            aa += a[i] * a[i];
            bb += b[i] * b[i];
        }

        return aa > 0 && bb > 0 ? ab / Math.Sqrt(aa * bb) : double.NaN;
    }

    /// <summary>Size ratio (larger ÷ smaller norm) of two P vectors.</summary>
    public static double SizeRatio(ReadOnlySpan<float> a, ReadOnlySpan<float> b)
    {
        double aa = 0, bb = 0;
        for (var i = 0; i < a.Length; i++)
        {
            aa += a[i] * a[i];
            bb += b[i] * b[i];
        }

        var r = Math.Sqrt(aa / Math.Max(bb, 1e-12));
        return r >= 1 ? r : 1 / Math.Max(r, 1e-6);
    }

    /// <summary>The mean of the vectors; null when there are none.</summary>
    public static float[]? Mean(IReadOnlyList<float[]> vectors)
    {
        if (vectors.Count == 0)
        {
            return null;
        }

        var mean = new float[vectors[0].Length];
        foreach (var v in vectors)
        {
            for (var i = 0; i < mean.Length; i++)
            {
                mean[i] += v[i];
            }
        }

        for (var i = 0; i < mean.Length; i++)
        {
            mean[i] /= vectors.Count;
        }

        return mean;
    }

    /// <summary>
    /// Distinct shapes: vectors are grouped (each joins the nearest group whose mean it resembles — similarity at least
    /// <paramref name="similarity"/>, size within a factor of 1.6 — or starts one; then every vector is reassigned to its
    /// nearest final group); a shape counts when its group holds at least <paramref name="minShare"/> of the vectors and
    /// at least two of them. <paramref name="dominantShare"/> is the share of the vectors in the largest group.
    /// </summary>
    public static int Count(IReadOnlyList<float[]> vectors, double similarity, double minShare, out double dominantShare)
    {
        dominantShare = double.NaN;
        if (vectors.Count == 0)
        {
            return 0;
        }

        var groups = new List<(float[] Sum, int N)>();
        foreach (var v in vectors)
        {
            var best = Nearest(groups, v, similarity);
            if (best < 0)
            {
                groups.Add(((float[])v.Clone(), 1));
            }
            else
            {
                var (sum, n) = groups[best];
                for (var i = 0; i < sum.Length; i++)
                {
                    sum[i] += v[i];
                }

                groups[best] = (sum, n + 1);
            }
        }

        var means = groups.Select(g => (Sum: g.Sum.Select(x => x / g.N).ToArray(), N: 0)).ToList();
        var counts = new int[means.Count];
        foreach (var v in vectors)
        {
            var best = Nearest(means, v, double.NegativeInfinity);
            if (best >= 0)
            {
                counts[best]++;
            }
        }

        var needed = Math.Max(2, minShare * vectors.Count);
        dominantShare = (double)counts.Max() / vectors.Count;
        return counts.Count(c => c >= needed);
    }

    private static int Nearest(List<(float[] Sum, int N)> groups, float[] v, double similarity)
    {
        var best = -1;
        var bestSim = similarity;
        var size = Norm(v);
        for (var g = 0; g < groups.Count; g++)
        {
            var sim = Similarity(groups[g].Sum, v);
            if (double.IsNaN(sim) || sim < bestSim)
            {
                continue;
            }

            // The group's mean size (its sum's size over its count; a reassignment pass holds means, N = 0).
            var groupSize = Norm(groups[g].Sum) / Math.Max(1, groups[g].N);
            var ratio = groupSize > size ? groupSize / Math.Max(size, 1e-9) : size / Math.Max(groupSize, 1e-9);
            if (double.IsNegativeInfinity(similarity) || ratio <= 1.6)
            {
                best = g;
                bestSim = sim;
            }
        }

        return best;
    }

    private static double Norm(ReadOnlySpan<float> v)
    {
        double s = 0;
        foreach (var x in v)
        {
            s += x * x;
        }

        return Math.Sqrt(s);
    }

    private static void Box(ReadOnlySpan<float> x, Span<float> y, int k)
    {
        // y[i] = mean of x[i … i + 2k].
        double sum = 0;
        for (var i = 0; i < 2 * k + 1; i++)
        {
            sum += x[i];
        }

        for (var i = 0; i < y.Length; i++)
        {
            y[i] = (float)(sum / (2 * k + 1));
            if (i + 2 * k + 1 < x.Length)
            {
                sum += x[i + 2 * k + 1] - x[i];
            }
        }
    }

    private static void Detrend(Span<float> x)
    {
        var a = (x[0] + x[1] + x[2]) / 3;
        var b = (x[^1] + x[^2] + x[^3]) / 3;
        var n = x.Length - 1;
        for (var i = 0; i < x.Length; i++)
        {
            x[i] -= a + (b - a) * (i - 1) / Math.Max(1, n - 2);
        }
    }
}
