using System.Numerics;
using System.Runtime.InteropServices;

namespace LongRecord.Analysis.Quality;

/// <summary>Vectorised reductions for the block statistics; a span's sum is taken in an order fixed by the span alone.</summary>
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

    public static (float Min, float Max) MinMax(ReadOnlySpan<float> x)
    {
        float min = float.PositiveInfinity, max = float.NegativeInfinity;
        var i = 0;
        if (Vector.IsHardwareAccelerated && x.Length >= Vector<float>.Count)
        {
            var vectors = MemoryMarshal.Cast<float, Vector<float>>(x);
            var vmin = new Vector<float>(float.PositiveInfinity);
            var vmax = new Vector<float>(float.NegativeInfinity);
            foreach (var v in vectors)
            {
                vmin = Vector.Min(vmin, v);
                vmax = Vector.Max(vmax, v);
            }

            for (var k = 0; k < Vector<float>.Count; k++)
            {
                min = Math.Min(min, vmin[k]);
                max = Math.Max(max, vmax[k]);
            }

            i = vectors.Length * Vector<float>.Count;
        }

        for (; i < x.Length; i++)
        {
            min = Math.Min(min, x[i]);
            max = Math.Max(max, x[i]);
        }

        return (min, max);
    }

    /// <summary>
    /// In one pass over <paramref name="x"/>[lag..]: sum, extremes, and the largest |x[i] − x[i − lag]| with its index
    /// counted from <paramref name="lag"/> (the first on ties); <c>HasNaN</c> when any sample of <paramref name="x"/> is
    /// NaN (the other results are then meaningless).
    /// </summary>
    public static (bool HasNaN, double Sum, float Min, float Max, float Peak, int At) Block(ReadOnlySpan<float> x, int lag)
    {
        var n = x.Length - lag;
        if (n <= 0)
        {
            return (HasNaN(x), 0, float.PositiveInfinity, float.NegativeInfinity, 0, 0);
        }

        var now = x[lag..];
        var before = x[..n];
        float sum = 0, min = float.PositiveInfinity, max = float.NegativeInfinity, peak = 0;
        var at = 0;
        var nan = false;
        var i = 0;
        var width = Vector<float>.Count;
        if (Vector.IsHardwareAccelerated && n >= width)
        {
            var a = MemoryMarshal.Cast<float, Vector<float>>(now);
            var b = MemoryMarshal.Cast<float, Vector<float>>(before);
            var vs = Vector<float>.Zero;
            var vmin = new Vector<float>(float.PositiveInfinity);
            var vmax = new Vector<float>(float.NegativeInfinity);
            var best = Vector<float>.Zero;
            var where = Vector<int>.Zero;
            var ok = Vector<int>.AllBitsSet;
            for (var k = 0; k < a.Length; k++)
            {
                var v = a[k];
                ok &= Vector.Equals(v, v) & Vector.Equals(b[k], b[k]);
                vs += v;
                vmin = Vector.Min(vmin, v);
                vmax = Vector.Max(vmax, v);
                // Per lane the largest slope and the first vector holding it.
                var slope = Vector.Abs(v - b[k]);
                var greater = Vector.GreaterThan(slope, best);
                best = Vector.ConditionalSelect(greater, slope, best);
                where = Vector.ConditionalSelect(greater, new Vector<int>(k), where);
            }

            nan = !Vector.EqualsAll(ok, Vector<int>.AllBitsSet);
            sum = Vector.Sum(vs);
            for (var lane = 0; lane < width; lane++)
            {
                min = Math.Min(min, vmin[lane]);
                max = Math.Max(max, vmax[lane]);
                var value = best[lane];
                var index = where[lane] * width + lane;
                if (value > peak || (value == peak && value > 0 && index < at))
                {
                    peak = value;
                    at = index;
                }
            }

            i = a.Length * width;
        }

        for (; i < n; i++)
        {
            var v = now[i];
            nan |= float.IsNaN(v) || float.IsNaN(before[i]);
            sum += v;
            min = Math.Min(min, v);
            max = Math.Max(max, v);
            var slope = Math.Abs(v - before[i]);
            if (slope > peak)
            {
                peak = slope;
                at = i;
            }
        }

        // The first lag samples are history only: a NaN there counts too.
        if (!nan && lag > n)
        {
            nan = HasNaN(x);
        }

        return (nan, sum, min, max, peak, at);
    }
}
