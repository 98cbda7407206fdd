using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// Bradycardia episodes: stretches where the averaged rate (sliding mean of K analysable intervals, K =
/// <c>RateAveragingBeats</c>) stays below the bradycardia rate, lasting at least the minimum duration. An episode runs
/// over the slow windows, trimmed of intervals at either end that are themselves faster than the rate.
/// </summary>
internal static class BradycardiaFinder
{
    public static List<RhythmEpisode> Find(RrSeries rr, BradycardiaSettings s, int k)
    {
        var episodes = new List<RhythmEpisode>();
        var sum = 0.0;
        var run = 0;
        var start = -1;
        var last = -1;
        for (var i = 1; i <= rr.Count; i++)
        {
            var slow = false;
            if (i < rr.Count && rr.IsAnalysable(i))
            {
                sum += rr.RrS[i];
                run++;
                if (run > k)
                {
                    sum -= rr.RrS[i - k];
                    run = k;
                }

                slow = run == k && 60.0 * k / sum < s.RateBpm;
            }
            else
            {
                sum = 0;
                run = 0;
            }

            if (slow)
            {
                // The window's first beat is beat i − k.
                start = start < 0 ? i - k : start;
                last = i;
                continue;
            }

            if (start >= 0)
            {
                Close(rr, start, last, s, k, episodes);
                start = -1;
            }
        }

        return episodes;
    }

    private static void Close(RrSeries rr, int firstBeat, int lastBeat, BradycardiaSettings s, int k, List<RhythmEpisode> episodes)
    {
        // The union of slow windows reaches into the faster rhythm on both sides: trim intervals faster than the rate.
        var slowRrS = 60.0 / s.RateBpm;
        while (firstBeat < lastBeat && rr.RrS[firstBeat + 1] < slowRrS)
        {
            firstBeat++;
        }

        while (lastBeat > firstBeat && rr.RrS[lastBeat] < slowRrS)
        {
            lastBeat--;
        }

        var a = rr.TimeS(firstBeat);
        var b = rr.TimeS(lastBeat);
        if (b - a < s.MinDurationS)
        {
            return;
        }

        var (max, min) = RateAverager.Extremes(rr, firstBeat + 1, lastBeat + 1, k);
        episodes.Add(new RhythmEpisode
        {
            Kind = RhythmEpisode.BradycardiaKind,
            StartS = a,
            EndS = b,
            Beats = lastBeat - firstBeat + 1,
            MeanBpm = 60.0 * (lastBeat - firstBeat) / (b - a),
            MaxBpm = max,
            MinBpm = min,
            OnsetObserved = firstBeat > 0 && rr.IsAnalysable(firstBeat),
            OffsetObserved = lastBeat + 1 < rr.Count && rr.IsAnalysable(lastBeat + 1),
        });
    }
}
