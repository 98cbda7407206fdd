using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// Turns the detector's AF-like intervals into episodes: bridges short interruptions (judged non-AF, unjudged, or
/// unanalysable with AF on both sides), splits at longer unanalysable time, and keeps stretches of at least the
/// minimum duration as AF (the rest as af-brief). Sets the Af and AfBrief flags on the analysable intervals.
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

            // Run of AF-like intervals [i, j), bridging short non-AF, unjudged or unanalysable stretches between them.
            var j = i;
            while (true)
            {
                while (j < n && rr.IsAnalysable(j) && rr.Has(j, IntervalFlags.AfLike))
                {
                    j++;
                }

                // Judged non-AF time counts against BridgeS; unjudged time (too little kept) against BridgeUnjudgedS;
                // unanalysable time (noise, a lead off for a moment: fibrillation does not stop because the signal was
                // unreadable) against BridgeUnanalysableS — its intervals are not flagged AF, the burden counts
                // analysable time only.
                var k = j;
                var gapS = 0.0;
                var unjudgedS = 0.0;
                var unanalysableS = 0.0;
                // After unreadable time the detector's window refills before it judges again: that unjudged time is
                // part of the interruption, so the unjudged allowance grows by the unanalysable one.
                bool WithinAllowances() => gapS < s.BridgeS && unanalysableS < s.BridgeUnanalysableS
                    && unjudgedS < (unanalysableS > 0 ? s.BridgeUnjudgedS + s.BridgeUnanalysableS : s.BridgeUnjudgedS);
                while (k < n && !(rr.IsAnalysable(k) && rr.Has(k, IntervalFlags.AfLike)) && WithinAllowances())
                {
                    if (!rr.IsAnalysable(k))
                    {
                        unanalysableS += rr.TimeS(k) - rr.TimeS(k - 1);
                    }
                    else if (rr.Has(k, IntervalFlags.Unjudged))
                    {
                        unjudgedS += rr.RrS[k];
                    }
                    else
                    {
                        gapS += rr.RrS[k];
                    }

                    k++;
                }

                if (k < n && k > j && WithinAllowances() && rr.IsAnalysable(k) && rr.Has(k, IntervalFlags.AfLike))
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
            var analysableS = 0.0;
            var analysableIntervals = 0;
            for (var q = i; q < j; q++)
            {
                if (rr.IsAnalysable(q))
                {
                    rr.Flags[q] |= flag;
                    analysableS += rr.RrS[q];
                    analysableIntervals++;
                }
            }

            var (maxBpm, minBpm) = RateAverager.Extremes(rr, i, j, averagingBeats);
            episodes.Add(new RhythmEpisode
            {
                Kind = kind,
                StartS = startS,
                EndS = endS,
                Beats = j - i + 1,
                MeanBpm = 60.0 * analysableIntervals / analysableS,
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
