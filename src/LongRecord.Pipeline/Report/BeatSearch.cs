using LongRecord.Analysis.Beats;

namespace LongRecord.Pipeline.Report;

/// <summary>Binary search in a time-ordered beat list.</summary>
public static class BeatSearch
{
    /// <summary>Index of the first beat at or after <paramref name="sample"/> (the count when there is none).</summary>
    public static int FirstAtOrAfter(IReadOnlyList<Beat> beats, double sample)
    {
        var lo = 0;
        var hi = beats.Count;
        while (lo < hi)
        {
            var mid = (lo + hi) >>> 1;
            if (beats[mid].Sample < sample)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }

        return lo;
    }
}
