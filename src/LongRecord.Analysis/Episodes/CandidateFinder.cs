using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Rhythm;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// Candidate episodes from the beats: runs of beats above the tachycardia rate (at least the minimum run of fast
/// beats, merged across interruptions of a few slower beats, the whole at a mean rate above the tachycardia rate),
/// runs of consecutive S or V beats (EC57 run classes: couplet counted, runs of three and more kept) and the rhythm
/// stage's AF episodes; overlapping candidates become one.
/// </summary>
internal static class CandidateFinder
{
    public static List<Candidate> Find(BeatTrack track, RhythmResult rhythm, EpisodeSettings s, out int sveCouplets, out int veCouplets)
    {
        var list = new List<Candidate>();
        FastRuns(track, s, list);
        ClassRuns(track, s, list, out sveCouplets, out veCouplets);
        foreach (var e in rhythm.Episodes)
        {
            if (e.Kind is RhythmEpisode.AfKind or RhythmEpisode.AfBriefKind)
            {
                var first = track.FirstAtOrAfter(e.StartS);
                var last = track.LastAtOrBefore(e.EndS);
                if (last > first)
                {
                    var c = new Candidate(first, last, CandidateSource.RhythmAf);
                    c.AfPieces.Add(e);
                    list.Add(c);
                }
            }
        }

        return Merge(list);
    }

    /// <summary>Merges overlapping candidates (transitively).</summary>
    public static List<Candidate> Merge(List<Candidate> list)
    {
        list.Sort((a, b) => a.First.CompareTo(b.First));
        var merged = new List<Candidate>();
        foreach (var c in list)
        {
            if (merged.Count > 0 && merged[^1].Overlaps(c))
            {
                merged[^1].Absorb(c);
            }
            else
            {
                merged.Add(c);
            }
        }

        return merged;
    }

    private static void FastRuns(BeatTrack track, EpisodeSettings s, List<Candidate> list)
    {
        var fastRrS = 60.0 / s.TachycardiaRateBpm;
        int first = -1, lastFast = -1, fastCount = 0, slow = 0;
        for (var i = 1; i < track.Count; i++)
        {
            var analysable = track.HasRr(i);
            var fast = analysable && track.RrS[i] < fastRrS;
            if (first >= 0 && (!analysable || (!fast && slow + 1 > s.MergeGapBeats)))
            {
                Close(track, s, list, first, lastFast, fastCount);
                first = -1;
            }

            if (fast)
            {
                if (first < 0)
                {
                    first = i;
                    fastCount = 0;
                }

                fastCount++;
                lastFast = i;
                slow = 0;
            }
            else if (first >= 0)
            {
                slow++;
            }
        }

        if (first >= 0)
        {
            Close(track, s, list, first, lastFast, fastCount);
        }
    }

    private static void Close(BeatTrack track, EpisodeSettings s, List<Candidate> list, int first, int last, int fastCount)
    {
        if (fastCount < s.RunMinimumBeats)
        {
            return;
        }

        // Mean over the run's own intervals, the one ending at its first beat included.
        double sum = 0;
        for (var i = first; i <= last; i++)
        {
            sum += track.RrS[i];
        }

        if (60.0 * (last - first + 1) / sum >= s.TachycardiaRateBpm)
        {
            list.Add(new Candidate(first, last, CandidateSource.Fast));
        }
    }

    private static void ClassRuns(BeatTrack track, EpisodeSettings s, List<Candidate> list, out int sveCouplets, out int veCouplets)
    {
        sveCouplets = 0;
        veCouplets = 0;
        var i = 0;
        while (i < track.Count)
        {
            var c = track[i].Class;
            if (c is not (BeatClass.S or BeatClass.V))
            {
                i++;
                continue;
            }

            var j = i;
            while (j + 1 < track.Count && track[j + 1].Class == c && track.HasRr(j + 1))
            {
                j++;
            }

            var n = j - i + 1;
            if (n == 2)
            {
                sveCouplets += c == BeatClass.S ? 1 : 0;
                veCouplets += c == BeatClass.V ? 1 : 0;
            }
            else if (n >= s.RunMinimumBeats)
            {
                list.Add(new Candidate(i, j, c == BeatClass.S ? CandidateSource.SveRun : CandidateSource.VeRun));
            }

            i = j + 1;
        }
    }
}
