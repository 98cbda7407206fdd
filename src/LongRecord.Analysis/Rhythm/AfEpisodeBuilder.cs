using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// Turns the detector's AF-like intervals into episodes: bridges short interruptions, splits at unanalysable time,
/// and keeps stretches of at least the minimum duration as AF (the rest as af-brief). Sets the Af and AfBrief flags.
/// </summary>
internal static class AfEpisodeBuilder
{
    public static List<RhythmEpisode> Build(RrSeries rr, AfSettings s, int averagingBeats)
    {
        var n = rr.Count;
        var episodes = new List<RhythmEpisode>();
        var i = 1;
        while (i < n)
        {
            if (!rr.IsAnalysable(i) || !rr.Has(i, IntervalFlags.AfLike))
            {
                i++;
                continue;
            }

            // Run of AF-like intervals [i, j), bridging non-AF stretches shorter than BridgeS inside one analysable stretch.
            var j = i;
            while (true)
            {
                while (j < n && rr.IsAnalysable(j) && rr.Has(j, IntervalFlags.AfLike))
                {
                    j++;
                }

                // Judged non-AF time counts against BridgeS; unjudged time (too little kept) against BridgeUnjudgedS.
                var k = j;
                var gapS = 0.0;
                var unjudgedS = 0.0;
                while (k < n && rr.IsAnalysable(k) && !rr.Has(k, IntervalFlags.AfLike) && gapS < s.BridgeS && unjudgedS < s.BridgeUnjudgedS)
                {
                    if (rr.Has(k, IntervalFlags.Unjudged))
                    {
                        unjudgedS += rr.RrS[k];
                    }
                    else
                    {
                        gapS += rr.RrS[k];
                    }

                    k++;
                }

                if (k < n && k > j && gapS < s.BridgeS && unjudgedS < s.BridgeUnjudgedS && rr.IsAnalysable(k) && rr.Has(k, IntervalFlags.AfLike))
                {
                    j = k;
                    continue;
                }

                break;
            }

            // Intervals i … j−1: beats i−1 … j−1.
            var startS = rr.TimeS(i - 1);
            var endS = rr.TimeS(j - 1);
            var kind = endS - startS >= s.MinEpisodeS ? RhythmEpisode.AfKind : RhythmEpisode.AfBriefKind;
            var flag = kind == RhythmEpisode.AfKind ? IntervalFlags.Af : IntervalFlags.AfBrief;
            for (var q = i; q < j; q++)
            {
                rr.Flags[q] |= flag;
            }

            var (maxBpm, minBpm) = RateAverager.Extremes(rr, i, j, averagingBeats);
            episodes.Add(new RhythmEpisode
            {
                Kind = kind,
                StartS = startS,
                EndS = endS,
                Beats = j - i + 1,
                MeanBpm = 60.0 * (j - i) / (endS - startS),
                MaxBpm = maxBpm,
                MinBpm = minBpm,
                OnsetObserved = rr.IsAnalysable(i - 1),
                OffsetObserved = j < n && rr.IsAnalysable(j),
            });
            i = j;
        }

        return episodes;
    }
}
