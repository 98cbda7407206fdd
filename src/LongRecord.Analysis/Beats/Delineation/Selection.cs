using System.Runtime.Intrinsics;

namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>Order statistics in place (Hoare's selection), so a median costs linear time and no allocation.</summary>
internal static class Selection
{
    /// <summary>The median of <paramref name="values"/> (the upper one for an even count); reorders the span.</summary>
    public static float Median(Span<float> values) => values.IsEmpty ? 0 : Nth(values, values.Length / 2);

    /// <summary>The value that would sit at <paramref name="n"/> if <paramref name="values"/> were sorted; reorders the span.</summary>
    public static float Nth(Span<float> values, int n)
    {
        // A short span (the delineator's few dozen segment slopes) by rank: the value with fewer than n + 1 values
        // below it and at least n + 1 at or below it. It has no unpredictable branches, which for a few dozen values
        // costs less than partitioning; the value is the same, since the order statistic does not depend on the method.
        if (values.Length <= RankLimit && (uint)n < (uint)values.Length && ByRank(values, n) is float ranked)
        {
            return ranked;
        }

        var lo = 0;
        var hi = values.Length - 1;
        while (lo < hi)
        {
            var pivot = values[(lo + hi) >>> 1];
            var i = lo;
            var j = hi;
            while (i <= j)
            {
                while (values[i] < pivot)
                {
                    i++;
                }

                while (values[j] > pivot)
                {
                    j--;
                }

                if (i <= j)
                {
                    (values[i], values[j]) = (values[j], values[i]);
                    i++;
                    j--;
                }
            }

            if (n <= j)
            {
                hi = j;
            }
            else if (n >= i)
            {
                lo = i;
            }
            else
            {
                break;
            }
        }

        return values[n];
    }

    private const int RankLimit = 64;

    // The n-th smallest by counting, for each value, the values below it and at or below it; null when no value
    // qualifies (a NaN among them), so the partitioning decides as before.
    private static float? ByRank(ReadOnlySpan<float> values, int n)
    {
        var count = values.Length;
        for (var c = 0; c < count; c++)
        {
            var v = values[c];
            int below = 0, atOrBelow = 0;
            var i = 0;
            if (Vector256.IsHardwareAccelerated)
            {
                var vv = Vector256.Create(v);
                var lt = Vector256<int>.Zero;
                var le = Vector256<int>.Zero;
                for (; i + 8 <= count; i += 8)
                {
                    var x = Vector256.Create(values.Slice(i, 8));
                    lt -= Vector256.LessThan(x, vv).AsInt32();
                    le -= Vector256.LessThanOrEqual(x, vv).AsInt32();
                }

                below = Vector256.Sum(lt);
                atOrBelow = Vector256.Sum(le);
            }

            for (; i < count; i++)
            {
                below += values[i] < v ? 1 : 0;
                atOrBelow += values[i] <= v ? 1 : 0;
            }

            if (below <= n && n < atOrBelow)
            {
                return v;
            }
        }

        return null;
    }
}
