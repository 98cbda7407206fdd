using System.Numerics;
using System.Runtime.Intrinsics;

namespace LongRecord.Analysis.Numerics;

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
    // qualifies (a NaN among them), so the partitioning decides as before. With vectors, eight candidates at a time
    // against every value broadcast in turn (no sum across lanes per candidate); the first candidate that qualifies
    // is the answer either way.
    private static float? ByRank(ReadOnlySpan<float> values, int n)
    {
        var count = values.Length;
        if (Vector256.IsHardwareAccelerated)
        {
            // Padding candidates are NaN: no value is below or equal to them, so they never qualify.
            Span<float> candidates = stackalloc float[RankLimit + 8];
            values.CopyTo(candidates);
            candidates.Slice(count, 8).Fill(float.NaN);
            var nv = Vector256.Create(n);
            for (var c = 0; c < count; c += 8)
            {
                var vv = Vector256.Create(candidates.Slice(c, 8));
                var lt = Vector256<int>.Zero;
                var le = Vector256<int>.Zero;
                foreach (var x in values)
                {
                    var xv = Vector256.Create(x);
                    lt -= Vector256.GreaterThan(vv, xv).AsInt32();
                    le -= Vector256.GreaterThanOrEqual(vv, xv).AsInt32();
                }

                var qualifies = Vector256.LessThanOrEqual(lt, nv) & Vector256.GreaterThan(le, nv);
                var mask = qualifies.ExtractMostSignificantBits();
                if (mask != 0)
                {
                    return candidates[c + BitOperations.TrailingZeroCount(mask)];
                }
            }

            return null;
        }

        for (var c = 0; c < count; c++)
        {
            var v = values[c];
            int below = 0, atOrBelow = 0;
            for (var i = 0; i < count; i++)
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
