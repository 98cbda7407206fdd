namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>Order statistics in place (Hoare's selection), so a median costs linear time and no allocation.</summary>
internal static class Selection
{
    /// <summary>The median of <paramref name="values"/> (the upper one for an even count); reorders the span.</summary>
    public static float Median(Span<float> values) => values.IsEmpty ? 0 : Nth(values, values.Length / 2);

    /// <summary>The value that would sit at <paramref name="n"/> if <paramref name="values"/> were sorted; reorders the span.</summary>
    public static float Nth(Span<float> values, int n)
    {
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
}
