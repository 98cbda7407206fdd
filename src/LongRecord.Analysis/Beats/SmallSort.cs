namespace LongRecord.Analysis.Beats;

/// <summary>
/// Ascending sort of the few RRs and peak levels whose medians the beat decisions take once per beat: an insertion
/// sort in place, which for a dozen values costs less than the general sort's set-up. The order it leaves is the
/// general sort's (a NaN hands the span to the general sort).
/// </summary>
internal static class SmallSort
{
    private const int Limit = 32;

    public static void Sort(Span<double> values)
    {
        if (values.Length > Limit)
        {
            values.Sort();
            return;
        }

        for (var i = 1; i < values.Length; i++)
        {
            var v = values[i];
            if (double.IsNaN(v) || double.IsNaN(values[0]))
            {
                values.Sort(); // NaN first, as the general sort orders it
                return;
            }

            var j = i - 1;
            while (j >= 0 && values[j] > v)
            {
                values[j + 1] = values[j];
                j--;
            }

            values[j + 1] = v;
        }
    }
}
