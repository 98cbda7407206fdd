using System.Numerics;
using System.Runtime.InteropServices;

namespace LongRecord.Analysis.Quality;

/// <summary>Vectorised reductions over NaN-free spans for the block statistics (the order of a span's sums is fixed by the span).</summary>
internal static class SpanStatistics
{
    public static bool HasNaN(ReadOnlySpan<float> x)
    {
        var i = 0;
        if (Vector.IsHardwareAccelerated && x.Length >= Vector<float>.Count)
        {
            var vectors = MemoryMarshal.Cast<float, Vector<float>>(x);
            foreach (var v in vectors)
            {
                if (!Vector.EqualsAll(v, v))
                {
                    return true;
                }
            }

            i = vectors.Length * Vector<float>.Count;
        }

        for (; i < x.Length; i++)
        {
            if (float.IsNaN(x[i]))
            {
                return true;
            }
        }

        return false;
    }

    public static (double Sum, float Min, float Max) SumMinMax(ReadOnlySpan<float> x)
    {
        float min = float.PositiveInfinity, max = float.NegativeInfinity, sum = 0;
        var i = 0;
        if (Vector.IsHardwareAccelerated && x.Length >= Vector<float>.Count)
        {
            var vectors = MemoryMarshal.Cast<float, Vector<float>>(x);
            var vs = Vector<float>.Zero;
            var vmin = new Vector<float>(float.PositiveInfinity);
            var vmax = new Vector<float>(float.NegativeInfinity);
            foreach (var v in vectors)
            {
                vs += v;
                vmin = Vector.Min(vmin, v);
                vmax = Vector.Max(vmax, v);
            }

            for (var k = 0; k < Vector<float>.Count; k++)
            {
                sum += vs[k];
                min = Math.Min(min, vmin[k]);
                max = Math.Max(max, vmax[k]);
            }

            i = vectors.Length * Vector<float>.Count;
        }

        for (; i < x.Length; i++)
        {
            sum += x[i];
            min = Math.Min(min, x[i]);
            max = Math.Max(max, x[i]);
        }

        return (sum, min, max);
    }

    /// <summary>Largest |x[i] − x[i − lag]| for i ≥ lag, and its index counted from <paramref name="lag"/> (the first on ties).</summary>
    public static (float Peak, int At) LaggedAbsolutePeak(ReadOnlySpan<float> x, int lag)
    {
        var n = x.Length - lag;
        if (n <= 0)
        {
            return (0, 0);
        }

        var now = x[lag..];
        var before = x[..n];
        var peak = 0f;
        var i = 0;
        if (Vector.IsHardwareAccelerated && n >= Vector<float>.Count)
        {
            var a = MemoryMarshal.Cast<float, Vector<float>>(now);
            var b = MemoryMarshal.Cast<float, Vector<float>>(before);
            var vmax = Vector<float>.Zero;
            for (var k = 0; k < a.Length; k++)
            {
                vmax = Vector.Max(vmax, Vector.Abs(a[k] - b[k]));
            }

            for (var k = 0; k < Vector<float>.Count; k++)
            {
                peak = Math.Max(peak, vmax[k]);
            }

            i = a.Length * Vector<float>.Count;
        }

        for (; i < n; i++)
        {
            peak = Math.Max(peak, Math.Abs(now[i] - before[i]));
        }

        // The position: the first sample reaching the peak.
        for (var k = 0; k < n; k++)
        {
            if (Math.Abs(now[k] - before[k]) == peak)
            {
                return (peak, k);
            }
        }

        return (peak, 0);
    }
}
