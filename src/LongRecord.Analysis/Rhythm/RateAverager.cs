namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// The averaged heart rate: 60 × K ÷ (sum of K consecutive analysable RR intervals), K = the averaging beats. One
/// premature beat and its compensatory pause barely move the sum, so no single beat sets a minimum or maximum.
/// </summary>
internal static class RateAverager
{
    /// <summary>Highest and lowest averaged rate over intervals [from, to); NaN when no K contiguous analysable intervals fit.</summary>
    public static (double MaxBpm, double MinBpm) Extremes(RrSeries rr, int from, int to, int k)
    {
        var max = double.NaN;
        var min = double.NaN;
        var sum = 0.0;
        var run = 0;
        for (var i = Math.Max(from, 1); i < to; i++)
        {
            if (!rr.IsAnalysable(i))
            {
                sum = 0;
                run = 0;
                continue;
            }

            sum += rr.RrS[i];
            run++;
            if (run > k)
            {
                sum -= rr.RrS[i - k];
                run = k;
            }

            if (run == k)
            {
                var bpm = 60.0 * k / sum;
                max = double.IsNaN(max) ? bpm : Math.Max(max, bpm);
                min = double.IsNaN(min) ? bpm : Math.Min(min, bpm);
            }
        }

        // A stretch shorter than K intervals still has a mean rate.
        if (double.IsNaN(max) && run > 0)
        {
            max = min = 60.0 * run / sum;
        }

        return (max, min);
    }
}
