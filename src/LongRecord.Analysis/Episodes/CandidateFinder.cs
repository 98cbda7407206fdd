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

        // A run of ectopic beats inside AF or inside a longer run of fast beats (a run of PACs during a sinus
        // tachycardia, a ve-run during AF) is an episode of its own, not part of what surrounds it.
        // In AF, irregular conducted beats are not S beats: an S run there stays part of the AF.
        var inside = list.Where(c => c.Source is CandidateSource.VeRun or CandidateSource.SveRun && list.Any(a => Surrounds(a, c))
            && !(c.Source == CandidateSource.SveRun && list.Any(a => a.Source == CandidateSource.RhythmAf && a.Overlaps(c)))).ToList();
        list.RemoveAll(inside.Contains);
        var merged = Merge(list);
        merged.AddRange(inside);
        merged.Sort((a, b) => a.First.CompareTo(b.First));
        return merged;
    }

    // AF around a ventricular run, or a run of fast beats more than twice as long as an ectopic run.
    private static bool Surrounds(Candidate a, Candidate run) =>
        a.Overlaps(run) && (run.Source == CandidateSource.VeRun
            ? a.Source == CandidateSource.RhythmAf || (a.Source == CandidateSource.Fast && a.BeatCount > 2 * run.BeatCount)
            : a.Source == CandidateSource.Fast && a.BeatCount > 2 * run.BeatCount);

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

    // Runs of at least the minimum run of consecutive fast intervals, merged across interruptions of a few slower
    // beats. Consecutive, so that the short coupling intervals of bigeminy (fast, slow, fast, slow) make no run.
    private static void FastRuns(BeatTrack track, EpisodeSettings s, List<Candidate> list)
    {
        var fastRrS = 60.0 / s.TachycardiaRateBpm;
        int first = -1, last = -1, runStart = -1;
        for (var i = 1; i <= track.Count; i++)
        {
            var analysable = i < track.Count && track.HasRr(i);
            var fast = analysable && track.RrS[i] < fastRrS;
            if (fast)
            {
                runStart = runStart < 0 ? i : runStart;
                continue;
            }

            // A run of consecutive fast intervals ended at beat i − 1.
            if (runStart >= 0 && i - runStart >= s.RunMinimumBeats)
            {
                if (first >= 0 && runStart - last - 1 <= s.MergeGapBeats && Analysable(track, last, runStart))
                {
                    last = i - 1;
                }
                else
                {
                    Close(track, s, list, first, last);
                    first = runStart;
                    last = i - 1;
                }
            }

            runStart = -1;
            if (!analysable && first >= 0)
            {
                Close(track, s, list, first, last);
                first = -1;
            }
        }

        Close(track, s, list, first, last);
    }

    // A premature S or V beat's short interval says nothing about the rate of the rhythm around it (and a V beat may
    // belong to a run of its own).
    private static bool NoEctopic(BeatTrack track, int from, int to)
    {
        for (var i = from; i <= to; i++)
        {
            if (track[i].Class is BeatClass.S or BeatClass.V)
            {
                return false;
            }
        }

        return true;
    }

    private static bool Analysable(BeatTrack track, int from, int to)
    {
        for (var i = from + 1; i <= to; i++)
        {
            if (!track.HasRr(i))
            {
                return false;
            }
        }

        return true;
    }

    private static void Close(BeatTrack track, EpisodeSettings s, List<Candidate> list, int first, int last)
    {
        if (first < 0)
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
            var (from, to) = Edges(track, s, first, last);
            list.Add(new Candidate(from, to, CandidateSource.Fast));
        }
    }

    // Near the tachycardia rate (an irregular MAT, the ramp of a sinus tachycardia) the RR cross the threshold back and
    // forth, so the first and last fast beats of the rhythm sit in pieces too short to make a run. An episode takes in
    // fast intervals at most the merge gap of slower beats beyond either end (once: no chain of them; not across S or V
    // beats), as it does between its own runs.
    private static (int First, int Last) Edges(BeatTrack track, EpisodeSettings s, int first, int last)
    {
        var fastRrS = 60.0 / s.TachycardiaRateBpm;
        var from = first;
        for (var j = first - 1 - s.MergeGapBeats; j < first; j++)
        {
            if (j >= 1 && track.HasRr(j) && track.RrS[j] < fastRrS && Analysable(track, j, first) && NoEctopic(track, j, first - 1))
            {
                from = j;
                break;
            }
        }

        var to = last;
        for (var j = last + 1 + s.MergeGapBeats; j > last; j--)
        {
            if (j < track.Count && track.HasRr(j) && track.RrS[j] < fastRrS && Analysable(track, last, j) && NoEctopic(track, last + 1, j))
            {
                to = j;
                break;
            }
        }

        return (from, to);
    }

    // Extends a labelled couplet [i, j] over neighbouring beats of a ventricular shape; true when that makes a run.
    private static bool VentricularRun(BeatTrack track, int i, int j, EpisodeSettings s, out int from, out int to)
    {
        from = i;
        to = j;
        while (from > 0 && track.HasRr(from) && track[from - 1].Class != BeatClass.V && track.VentricularShape(from - 1))
        {
            from--;
        }

        while (to + 1 < track.Count && track.HasRr(to + 1) && track[to + 1].Class != BeatClass.V && track.VentricularShape(to + 1))
        {
            to++;
        }

        if (to - from + 1 < s.RunMinimumBeats)
        {
            return false;
        }

        // Only at tachycardia rate: a ventricular run that grows over its neighbours is a ventricular tachycardia;
        // slow runs of one shape (paced rhythm read as V among them) stay as their labels say.
        double sum = 0;
        for (var k = from + 1; k <= to; k++)
        {
            sum += track.RrS[k];
        }

        return sum / (to - from) < 60.0 / s.TachycardiaRateBpm;
    }

    // A pause after a V this many times its coupling interval is its compensatory pause (see QBetweenLikeV).
    private const double CompensatoryRatio = 1.8;

    // Beat j is V, beat j + 1 unclassifiable (Q) and beat j + 2 V of beat j's template, all three broad: the Q beat sits
    // inside a ventricular run (MITDB 223 at 1442 s: V, Q, V on one ventricular template, 144, 137 and 154 ms).
    private static bool QBetweenLikeV(BeatTrack track, int j, EpisodeSettings s)
    {
        if (j + 2 >= track.Count || track[j + 1].Class != BeatClass.Q || track[j + 2].Class != BeatClass.V || !track.HasRr(j + 2))
        {
            return false;
        }

        // All three broad: in bigeminy a normal beat read Q is narrow, and so are narrow beats misread V.
        var broad = s.BroadQrsMs;
        if (!(track[j].Template >= 0 && track[j + 2].Template == track[j].Template
            && track[j].QrsMs >= broad && track[j + 1].QrsMs >= broad && track[j + 2].QrsMs >= broad))
        {
            return false;
        }

        // A Q after a pause of at least 1.8 times the first V's coupling interval sits where the V's compensatory
        // pause puts the next sinus beat: ventricular bigeminy, a normal beat whose width noise has widened (the
        // synthesiser's bigeminy in 12 dB muscle noise), not a beat of a run. 1.8: our choice (MITDB 223's run at
        // 1442 s: 808 ms after a coupling of 525 ms).
        return !(track.HasRr(j) && track.RrS[j + 1] >= CompensatoryRatio * track.RrS[j]);
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
            while (j + 1 < track.Count && track.HasRr(j + 1))
            {
                if (track[j + 1].Class == c)
                {
                    j++;
                }
                else if (c == BeatClass.V && QBetweenLikeV(track, j, s))
                {
                    j += 2; // ventricular beats of one shape on both sides of an unclassifiable beat: one run
                }
                else
                {
                    break;
                }
            }

            var n = j - i + 1;
            if (n == 2)
            {
                sveCouplets += c == BeatClass.S ? 1 : 0;
                veCouplets += c == BeatClass.V ? 1 : 0;
            }

            if (n >= s.RunMinimumBeats)
            {
                list.Add(new Candidate(i, j, c == BeatClass.S ? CandidateSource.SveRun : CandidateSource.VeRun));
            }
            else if (c == BeatClass.V && n == 2 && VentricularRun(track, i, j, s, out var from, out var to))
            {
                // A couplet beside beats of a ventricular shape whose own label is N or Q, at tachycardia rate: in
                // multiform records the first or last beat of a run often carries a label of its own, but its shape is
                // the run's.
                list.Add(new Candidate(from, to, CandidateSource.VeRun));
            }

            i = j + 1;
        }
    }
}
