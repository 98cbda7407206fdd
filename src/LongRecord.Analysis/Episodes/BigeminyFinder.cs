using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// Ventricular bigeminy (N V N V …), ventricular trigeminy (N N V N N V …) and atrial bigeminy (N S N S …): at least
/// the minimum number of cycles in a row. One deviating cycle between two stretches of the same pattern (a missed or
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
            if (!Cycle(track, ectopic, period, i, taken))
            {
                i++;
                continue;
            }

            var last = i;
            var cycles = 1;
            while (last + period < track.Count && Cycle(track, ectopic, period, last + period, taken))
            {
                last += period;
                cycles++;
            }

            chains.Add((i - (period - 1), last, cycles));
            i = last + 1;
        }

        // Bridge one deviating cycle between chains of the pattern.
        var merged = new List<(int First, int Last, int Cycles)>();
        foreach (var c in chains)
        {
            if (merged.Count > 0 && c.First - merged[^1].Last <= period + 1 && Analysable(track, merged[^1].Last, c.First))
            {
                merged[^1] = (merged[^1].First, c.Last, merged[^1].Cycles + c.Cycles);
            }
            else
            {
                merged.Add(c);
            }
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

    // Beat e is ectopic and the period − 1 beats before it are normal, all intervals analysable and not yet taken.
    private static bool Cycle(BeatTrack track, BeatClass ectopic, int period, int e, bool[] taken)
    {
        if (track[e].Class != ectopic || taken[e] || !track.HasRr(e))
        {
            return false;
        }

        for (var k = e - period + 1; k < e; k++)
        {
            if (k < 0 || track[k].Class != BeatClass.N || taken[k] || (k > e - period + 1 && !track.HasRr(k)))
            {
                return false;
            }
        }

        return true;
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
