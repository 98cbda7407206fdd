using LongRecord.Analysis.Beats;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// Regularity of an episode's RR intervals: the coefficient of variation, and the mean absolute successive difference
/// over the mean RR (insensitive to a slow trend such as the rise of a sinus tachycardia, sensitive to beat-to-beat
/// irregularity). Only intervals inside the episode (both beats in it) count.
/// </summary>
internal readonly record struct RrRegularity(int Intervals, double MeanRrS, double Cv, double SuccessiveChange)
{
    public static RrRegularity Of(BeatTrack t, int first, int last) => Of(t, first, last, normalOnly: false);

    /// <summary>
    /// The same over the intervals between two normal (N-class) beats only: the underlying rhythm with the premature
    /// beats' coupling intervals and the pauses after them left out.
    /// </summary>
    public static RrRegularity NormalToNormal(BeatTrack t, int first, int last) => Of(t, first, last, normalOnly: true);

    private static bool Counts(BeatTrack t, int i, bool normalOnly) =>
        t.HasRr(i) && (!normalOnly || (t[i].Class == BeatClass.N && t[i - 1].Class == BeatClass.N));

    private static RrRegularity Of(BeatTrack t, int first, int last, bool normalOnly)
    {
        double sum = 0, squares = 0, change = 0;
        int n = 0, pairs = 0;
        for (var i = first + 1; i <= last; i++)
        {
            if (!Counts(t, i, normalOnly))
            {
                continue;
            }

            sum += t.RrS[i];
            squares += (double)t.RrS[i] * t.RrS[i];
            n++;
            if (i > first + 1 && Counts(t, i - 1, normalOnly))
            {
                change += Math.Abs(t.RrS[i] - t.RrS[i - 1]);
                pairs++;
            }
        }

        if (n < 2)
        {
            return new RrRegularity(n, n == 1 ? sum : double.NaN, double.NaN, double.NaN);
        }

        var mean = sum / n;
        var sd = Math.Sqrt(Math.Max(0, (squares - n * mean * mean) / (n - 1)));
        return new RrRegularity(n, mean, sd / mean, pairs > 0 ? change / pairs / mean : double.NaN);
    }

    /// <summary>
    /// Share of the RR intervals within <paramref name="tolerance"/> cycles of a whole number (≥ 1) of cycles of
    /// <paramref name="cycleS"/>, searched over cycles within ± 4 % (the spectral estimate's error) in 0.5 % steps; the
    /// cycle returned is the best one refined by least squares over its on-grid intervals.
    /// </summary>
    public static (double Share, double CycleS) ClusterAtMultiples(BeatTrack t, int first, int last, double cycleS, double tolerance)
    {
        var best = (Share: 0.0, CycleS: cycleS);
        for (var step = -8; step <= 8; step++)
        {
            var c = cycleS * (1 + 0.005 * step);
            int n = 0, hit = 0;
            for (var i = first + 1; i <= last; i++)
            {
                if (!t.HasRr(i))
                {
                    continue;
                }

                var m = Math.Round(t.RrS[i] / c);
                n++;
                hit += m >= 1 && Math.Abs(t.RrS[i] - m * c) <= tolerance * c ? 1 : 0;
            }

            if (n > 0 && (double)hit / n > best.Share)
            {
                best = ((double)hit / n, c);
            }
        }

        return (best.Share, Refine(t, first, last, best.CycleS, tolerance));
    }

    // The cycle that fits the on-grid intervals best in the least-squares sense, Σ RR·m ÷ Σ m² over the intervals
    // within the tolerance of m cycles: the search above only steps by 0.5 % and its share is flat across the
    // tolerance, while four cycles of a 3 % error put a 4:1 interval near the edge (variable flutter at 290/min read
    // 298/min from the spectrum, and its 4:1 intervals fell off the grid in noise).
    private static double Refine(BeatTrack t, int first, int last, double cycleS, double tolerance)
    {
        double rm = 0, mm = 0;
        for (var i = first + 1; i <= last; i++)
        {
            if (!t.HasRr(i))
            {
                continue;
            }

            var m = Math.Round(t.RrS[i] / cycleS);
            if (m >= 1 && Math.Abs(t.RrS[i] - m * cycleS) <= tolerance * cycleS)
            {
                rm += t.RrS[i] * m;
                mm += m * m;
            }
        }

        return mm > 0 ? rm / mm : cycleS;
    }
}
