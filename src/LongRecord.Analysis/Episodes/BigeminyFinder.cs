using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// Ventricular bigeminy (N V N V …), ventricular trigeminy (N N V N N V …) and atrial bigeminy (N S N S …): at least
/// the minimum number of cycles in a row; an unclassifiable (Q) beat that comes early (and is broad,
/// for a ventricular pattern) may stand for the ectopic beat when at least one of the chain's ectopic beats carries the
/// label. One deviating cycle between two stretches of the same pattern (each of at least two cycles; a missed or
/// misread beat) does not break it. An episode runs from the first normal beat of its first cycle to its last
/// ectopic beat.
/// </summary>
internal static class BigeminyFinder
{
    public static List<(int First, int Last, string Kind, int Cycles)> Find(BeatTrack track, EpisodeSettings s)
    {
        var taken = new bool[track.Count];
        var found = new List<(int First, int Last, string Kind, int Cycles)>();
        Pattern(track, s, BeatClass.V, 2, EpisodeKinds.VentricularBigeminy, taken, found);
        Pattern(track, s, BeatClass.S, 2, EpisodeKinds.AtrialBigeminy, taken, found);
        Pattern(track, s, BeatClass.V, 3, EpisodeKinds.VentricularTrigeminy, taken, found);
        found.Sort((a, b) => a.First.CompareTo(b.First));
        return found;
    }

    private static void Pattern(BeatTrack track, EpisodeSettings s, BeatClass ectopic, int period, string kind, bool[] taken,
        List<(int, int, string, int)> found)
    {
        var chains = new List<(int First, int Last, int Cycles)>();
        var i = period - 1;
        while (i < track.Count)
        {
            var c = Cycle(track, ectopic, period, i, taken, s.BroadQrsMs);
            if (c == Match.None)
            {
                i++;
                continue;
            }

            var last = i;
            var cycles = 1;
            var labelled = c == Match.Labelled ? 1 : 0;
            while (last + period < track.Count && Cycle(track, ectopic, period, last + period, taken, s.BroadQrsMs) is var next && next != Match.None)
            {
                last += period;
                cycles++;
                labelled += next == Match.Labelled ? 1 : 0;
            }

            // At least one ectopic beat carries the ectopic label; the rest may be premature unclassifiable beats
            // (broad ones, for a ventricular pattern).
            if (labelled >= 1)
            {
                chains.Add((i - (period - 1), last, cycles));
            }

            i = last + 1;
        }

        // Bridge one deviating cycle between stretches of the pattern: each side at least two cycles in a row, or
        // isolated ectopic beats a few normal beats apart (N N N N V N N N N V …) would chain into a "trigeminy".
        var merged = new List<(int First, int Last, int Cycles)>();
        var lastRun = 0;
        foreach (var c in chains)
        {
            if (merged.Count > 0 && lastRun >= 2 && c.Cycles >= 2 && c.First - merged[^1].Last <= period + 1 && Analysable(track, merged[^1].Last, c.First))
            {
                merged[^1] = (merged[^1].First, c.Last, merged[^1].Cycles + c.Cycles);
            }
            else
            {
                merged.Add(c);
            }

            lastRun = c.Cycles;
        }

        foreach (var c in merged)
        {
            if (c.Cycles < s.BigeminyMinimumCycles)
            {
                continue;
            }

            for (var k = c.First; k <= c.Last; k++)
            {
                taken[k] = true;
            }

            found.Add((c.First, c.Last, kind, c.Cycles));
        }
    }

    private enum Match
    {
        None,
        Labelled,
        Premature,
    }

    // Beat e is ectopic (by label, or an unclassifiable beat that comes early — its RR under 85 % of the one before,
    // common practice, no source — and is broad for a ventricular pattern) and the period − 1 beats before it are normal, all intervals analysable and not
    // yet taken.
    private static Match Cycle(BeatTrack track, BeatClass ectopic, int period, int e, bool[] taken, double broadQrsMs)
    {
        if (taken[e] || !track.HasRr(e))
        {
            return Match.None;
        }

        var c = track[e].Class;
        var match = c == ectopic ? Match.Labelled
            : c == BeatClass.Q && e > 0 && track.HasRr(e - 1) && track.RrS[e] < 0.85 * track.RrS[e - 1]
                && (ectopic != BeatClass.V || track[e].QrsMs >= broadQrsMs) ? Match.Premature
            : Match.None;
        if (match == Match.None)
        {
            return Match.None;
        }

        for (var k = e - period + 1; k < e; k++)
        {
            if (k < 0 || track[k].Class != BeatClass.N || taken[k] || (k > e - period + 1 && !track.HasRr(k)))
            {
                return Match.None;
            }
        }

        return match;
    }

    private static bool Analysable(BeatTrack track, int from, int to)
    {
        for (var k = from + 1; k <= to; k++)
        {
            if (!track.HasRr(k))
            {
                return false;
            }
        }

        return true;
    }
}
