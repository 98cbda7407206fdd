using LongRecord.Analysis.Numerics;

namespace LongRecord.Analysis.Beats;

/// <summary>
/// Ascending sort of the few RRs, peak levels and noise ratios whose medians the beat decisions take once per beat:
/// an insertion sort in place, which for a few dozen values costs less than the general sort's set-up. The order it
/// leaves is the general sort's (a span holding NaN goes to the general sort, which puts NaN first).
/// </summary>
internal static class SmallSort
{
    private const int Limit = 32;

    public static void Sort(Span<double> values)
    {
        if (values.Length > Limit || SpanStatistics.HasNaN(values))
        {
            values.Sort();
            return;
        }

        for (var i = 1; i < values.Length; i++)
        {
            var v = values[i];
            var j = i - 1;
            while (j >= 0 && values[j] > v)
            {
                values[j + 1] = values[j];
                j--;
            }

            values[j + 1] = v;
        }
    }

    /// <summary>The median (the mean of the two middle values for an even count); sorts the span in place.</summary>
    public static double Median(Span<double> values)
    {
        Sort(values);
        var n = values.Length;
        return n % 2 == 1 ? values[n / 2] : 0.5 * (values[n / 2 - 1] + values[n / 2]);
    }
}
