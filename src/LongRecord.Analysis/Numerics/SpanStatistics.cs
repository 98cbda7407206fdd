using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace LongRecord.Analysis.Numerics;

/// <summary>
/// Vectorised reductions over spans of samples (gaps, extremes, the quality monitor's block statistics); a span's sum is
/// taken in an order fixed by the span alone, and every result equals the one-element-at-a-time loop's.
/// </summary>
internal static class SpanStatistics
{
    /// <summary>
    /// Whether the span holds a NaN (a gap in the signal). <c>ContainsAnyExceptInRange(−∞, +∞)</c> answers the same
    /// question, but for floating-point types it runs one element and two comparisons at a time (it was the largest
    /// single item of delineation's own time).
    /// </summary>
    public static bool HasNaN(ReadOnlySpan<float> x) => HasNaNOf(x);

    /// <summary>Whether the span holds a NaN.</summary>
    public static bool HasNaN(ReadOnlySpan<double> x) => HasNaNOf(x);

    // One body for both widths: the runtime compiles it apart for each, so it costs what a hand-written copy does.
    private static bool HasNaNOf<T>(ReadOnlySpan<T> x)
        where T : unmanaged, IFloatingPointIeee754<T>
    {
        var i = 0;
        if (Vector.IsHardwareAccelerated && x.Length >= Vector<T>.Count)
        {
            foreach (var v in MemoryMarshal.Cast<T, Vector<T>>(x))
            {
                if (!Vector.EqualsAll(v, v))
                {
                    return true;
                }
            }

            i = x.Length - x.Length % Vector<T>.Count;
        }

        for (; i < x.Length; i++)
        {
            if (T.IsNaN(x[i]))
            {
                return true;
            }
        }

        return false;
    }

    // Across the lanes of one vector of floats or ints. Vector128.Min and .Max are IEEE minimum and maximum for floats
    // (NaN wins, −0 below +0), as Math.Min and Math.Max, so halving the vector gives what a loop over the lanes gives,
    // in fewer steps.
    private static T LaneMin<T>(Vector<T> v)
        where T : unmanaged, INumber<T>
    {
        if (Vector<T>.Count == 8)
        {
            var h = Vector128.Min(v.AsVector256().GetLower(), v.AsVector256().GetUpper());
            h = Vector128.Min(h, Swap(h, 2, 3, 0, 1));
            return Vector128.Min(h, Swap(h, 1, 0, 3, 2)).ToScalar();
        }

        var min = v[0];
        for (var lane = 1; lane < Vector<T>.Count; lane++)
        {
            min = T.Min(min, v[lane]);
        }

        return min;
    }

    private static T LaneMax<T>(Vector<T> v)
        where T : unmanaged, INumber<T>
    {
        if (Vector<T>.Count == 8)
        {
            var h = Vector128.Max(v.AsVector256().GetLower(), v.AsVector256().GetUpper());
            h = Vector128.Max(h, Swap(h, 2, 3, 0, 1));
            return Vector128.Max(h, Swap(h, 1, 0, 3, 2)).ToScalar();
        }

        var max = v[0];
        for (var lane = 1; lane < Vector<T>.Count; lane++)
        {
            max = T.Max(max, v[lane]);
        }

        return max;
    }

    // The four 32-bit lanes of h reordered (float or int); inlined, so the constant order compiles to one shuffle.
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static Vector128<T> Swap<T>(Vector128<T> h, int a, int b, int c, int d)
        where T : unmanaged =>
        Vector128.Shuffle(h.AsInt32(), Vector128.Create(a, b, c, d)).As<int, T>();

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

            min = LaneMin(vmin);
            max = LaneMax(vmax);
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
    /// The largest |x[i]| and the first index holding it, or (0, −1) when every value is 0 (no value is NaN). The same
    /// as the loop that keeps a value only when it exceeds the largest so far, starting from 0.
    /// </summary>
    public static (float Peak, int At) AbsolutePeak(ReadOnlySpan<float> x)
    {
        var peak = 0f;
        var i = 0;
        if (Vector.IsHardwareAccelerated && x.Length >= Vector<float>.Count)
        {
            var vectors = MemoryMarshal.Cast<float, Vector<float>>(x);
            var vmax = Vector<float>.Zero;
            foreach (var v in vectors)
            {
                vmax = Vector.Max(vmax, Vector.Abs(v));
            }

            peak = LaneMax(vmax);
            i = vectors.Length * Vector<float>.Count;
        }

        for (; i < x.Length; i++)
        {
            peak = Math.Max(peak, Math.Abs(x[i]));
        }

        if (!(peak > 0))
        {
            return (0, -1);
        }

        for (var j = 0; j < x.Length; j++)
        {
            if (Math.Abs(x[j]) == peak)
            {
                return (peak, j);
            }
        }

        throw new InvalidOperationException("the peak was not found again");
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
            min = LaneMin(vmin);
            max = LaneMax(vmax);
            // The largest slope, at the first index holding it (none above 0: peak 0 at 0).
            var top = LaneMax(best);
            if (top > 0)
            {
                var index = where * width + Vector<int>.Indices;
                peak = top;
                at = LaneMin(Vector.ConditionalSelect(Vector.Equals(best, new Vector<float>(top)), index, new Vector<int>(int.MaxValue)));
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
