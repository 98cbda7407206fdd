using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// Flutter with variable conduction keeps its flutter cycle while the ventricular rate falls below the tachycardia rate
/// (3:1, 4:1 stretches) and the rhythm stage may see only pieces of it. A flutter episode is therefore extended beat by
/// beat, both ways, while the RR stays a whole number (≥ 2) of flutter cycles (one interval off is bridged when the
/// next three are on), and flutter episodes that then meet or
/// overlap become one; other candidates wholly inside it are absorbed, but for ventricular runs, which stay episodes.
/// </summary>
internal static class FlutterExtent
{
    private const double Tolerance = 0.12;

    // Between two flutter pieces: the tolerance of FlutterBetween, and the longest stretch it joins (our choices).
    private const double BetweenTolerance = 0.18, MaxBetweenS = 30;

    public static List<Draft> Extend(List<Draft> drafts, BeatTrack t, AnalysisSettings settings)
    {
        var result = new List<Draft>();
        foreach (var d in drafts.OrderBy(d => d.First))
        {
            if (d.RawKind != EpisodeKinds.Flutter || d.Facts is null || double.IsNaN(d.Episode.Atrial.AtrialRateBpm))
            {
                result.Add(d);
                continue;
            }

            var cycle = 60 / d.Episode.Atrial.AtrialRateBpm;
            var first = d.First;
            var last = d.Last;
            // One interval off the multiples (a beat placed a little late in noise) does not end it when the next
            // three are on them again.
            while (first > 0 && (Multiple(t, first, cycle) || (first > 3 && Multiple(t, first - 1, cycle) && Multiple(t, first - 2, cycle) && Multiple(t, first - 3, cycle))))
            {
                first--;
            }

            while (last + 1 < t.Count && (Multiple(t, last + 1, cycle)
                || (last + 4 < t.Count && Multiple(t, last + 2, cycle) && Multiple(t, last + 3, cycle) && Multiple(t, last + 4, cycle))))
            {
                last++;
            }

            // Sinus beside flutter lands near four cycles now and then: two long intervals in a row at an end of
            // the walk are sinus rhythm, not flutter (at most four such beats are given back).
            for (var k = 0; k < 4 && first < d.First && Long(t, first, cycle) && Long(t, first + 1, cycle); k++)
            {
                first++;
            }

            for (var k = 0; k < 4 && last > d.Last && Long(t, last, cycle) && Long(t, last - 1, cycle); k++)
            {
                last--;
            }

            result.Add(d with { First = first, Last = last });
        }

        // Merge flutter drafts that meet; drop any other draft wholly inside a flutter one, except a ventricular one:
        // ventricular beats during flutter are an episode of their own, as during AF (set aside, added back below).
        result.Sort((a, b) => a.First.CompareTo(b.First));
        var merged = new List<Draft>();
        var ventricularInside = new List<Draft>();
        foreach (var d in result)
        {
            if (merged.Count > 0)
            {
                var p = merged[^1];
                var pFlutter = p.RawKind == EpisodeKinds.Flutter;
                var dFlutter = d.RawKind == EpisodeKinds.Flutter;
                if (dFlutter && JoinAcross(merged, d, t, ventricularInside))
                {
                    continue;
                }

                if (pFlutter && dFlutter && d.First <= p.Last + 1)
                {
                    merged[^1] = p with { Last = Math.Max(p.Last, d.Last) };
                    continue;
                }

                if (pFlutter && d.Last <= p.Last)
                {
                    if (d.Episode.Kind is EpisodeKinds.VeRun or EpisodeKinds.BroadTachycardia)
                    {
                        ventricularInside.Add(d);
                    }

                    continue;
                }

                if (dFlutter && p.First >= d.First && p.Last <= d.Last)
                {
                    if (p.Episode.Kind is EpisodeKinds.VeRun or EpisodeKinds.BroadTachycardia)
                    {
                        ventricularInside.Add(p);
                    }

                    merged[^1] = d;
                    continue;
                }
            }

            merged.Add(d);
        }

        // Rebuild the episodes whose extent changed.
        for (var i = 0; i < merged.Count; i++)
        {
            var d = merged[i];
            if (d.RawKind == EpisodeKinds.Flutter && (d.Episode.StartS != t.TimeS(d.First) || d.Episode.EndS != t.TimeS(d.Last)))
            {
                merged[i] = CandidateDescriber.Remeasured(d, d.First, d.Last, t, settings);
            }
        }

        merged.AddRange(ventricularInside);
        merged.Sort((a, b) => a.First.CompareTo(b.First));
        return merged;
    }

    // A flutter draft joins the last flutter one before it across the drafts between (which it then absorbs, but for
    // ventricular runs) when the intervals between the two are the flutter's (FlutterBetween).
    private static bool JoinAcross(List<Draft> merged, Draft d, BeatTrack t, List<Draft> ventricularInside)
    {
        var q = merged.FindLastIndex(m => m.RawKind == EpisodeKinds.Flutter);
        if (q < 0 || d.First <= merged[q].Last + 1 || !FlutterBetween(t, merged[q], d))
        {
            return false;
        }

        var last = d.Last;
        for (var i = q + 1; i < merged.Count; i++)
        {
            last = Math.Max(last, merged[i].Last);
            if (merged[i].Episode.Kind is EpisodeKinds.VeRun or EpisodeKinds.BroadTachycardia)
            {
                ventricularInside.Add(merged[i]);
            }
        }

        merged[q] = merged[q] with { Last = last };
        merged.RemoveRange(q + 1, merged.Count - q - 1);
        return true;
    }

    // Between two flutter pieces, every interval within a wider tolerance of a whole number (≥ 2) of the cycle and at
    // least a quarter of them 2:1 or 3:1: the same flutter, whose beats the walk could not follow in noise (a beat's
    // time moved by 30 ms breaks it). Sinus rhythm beside flutter can land near four cycles, never near two or three
    // beat after beat.
    private static bool FlutterBetween(BeatTrack t, Draft p, Draft d)
    {
        var cycle = 60 / p.Episode.Atrial.AtrialRateBpm;
        if (!(cycle > 0) || t.TimeS(d.First) - t.TimeS(p.Last) > MaxBetweenS)
        {
            return false;
        }

        int intervals = 0, shortOnes = 0;
        for (var i = p.Last + 1; i <= d.First; i++)
        {
            if (!t.HasRr(i))
            {
                return false;
            }

            var m = Math.Round(t.RrS[i] / cycle);
            if (m < 2 || Math.Abs(t.RrS[i] - m * cycle) > BetweenTolerance * cycle)
            {
                return false;
            }

            intervals++;
            shortOnes += m <= 3 ? 1 : 0;
        }

        return intervals > 0 && shortOnes >= 0.25 * intervals;
    }

    // The RR ending at beat i is a whole number (≥ 2) of flutter cycles, or it is together with the RR before or after
    // it: flutter waves on the QRS move a beat's detected time by up to about 30 ms (the synthetic flutter with variable
    // conduction at 24 dB), which puts both intervals around that beat off the grid while their sum stays on it (checked next to a 2:1
    // interval only).
    private static bool Multiple(BeatTrack t, int i, double cycle)
    {
        if (!t.HasRr(i))
        {
            return false;
        }

        return OnGrid(t.RrS[i], cycle, 2)
            || (i > 1 && t.HasRr(i - 1) && Pair(t.RrS[i - 1], t.RrS[i], cycle))
            || (i + 1 < t.Count && t.HasRr(i + 1) && Pair(t.RrS[i], t.RrS[i + 1], cycle));
    }

    // Only around a 2:1 interval: two sinus intervals near four cycles each would otherwise walk the episode into the
    // sinus rhythm beside it.
    private static bool Pair(double aS, double bS, double cycle) => Math.Min(aS, bS) < 2.5 * cycle && OnGrid(aS + bS, cycle, 4);

    private static bool Long(BeatTrack t, int i, double cycle) => i >= 1 && i < t.Count && t.HasRr(i) && t.RrS[i] >= 3.5 * cycle;

    private static bool OnGrid(double intervalS, double cycle, int fewest)
    {
        var m = Math.Round(intervalS / cycle);
        return m >= fewest && Math.Abs(intervalS - m * cycle) <= Tolerance * cycle;
    }
}
