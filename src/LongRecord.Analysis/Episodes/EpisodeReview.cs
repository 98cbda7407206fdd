using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// What a reviewer should see: every episode gets its reasons (urgent, broad complex, longest, fastest or slowest of
/// its kind, first onset of its kind, a symptom event nearby, low confidence, a highlighted pause), its strips (onset
/// and offset with context), a group (nearby episodes of one kind: one representative and a count) and a rank
/// (flagged first; urgent, then broad, then symptom, then more reasons, then longer). Flagged means at least one reason.
/// </summary>
internal static class EpisodeReview
{
    private static readonly HashSet<string> s_noRate = [EpisodeKinds.Pause, EpisodeKinds.SignalLoss, EpisodeKinds.Vf, EpisodeKinds.Bradycardia];

    public static List<Episode> Apply(List<Episode> episodes, IReadOnlyList<SymptomEventInput> events, double durationS, EpisodeSettings s)
    {
        var reasons = episodes.Select(_ => new List<string>()).ToList();
        var symptoms = episodes.Select(_ => new List<int>()).ToList();
        var sortedEvents = events.Select((e, i) => (e, i)).OrderBy(x => x.e.TimeS).ToList();
        for (var i = 0; i < episodes.Count; i++)
        {
            var e = episodes[i];
            if (e.Urgent)
            {
                reasons[i].Add("urgent");
            }

            if (e.Width == QrsWidth.Broad || e.Kind is EpisodeKinds.BroadTachycardia or EpisodeKinds.VeRun or EpisodeKinds.IdioventricularRhythm)
            {
                reasons[i].Add("broad-complex");
            }

            for (var k = 0; k < sortedEvents.Count; k++)
            {
                var t = sortedEvents[k].e.TimeS;
                if (t >= e.StartS - s.SymptomWindowS && t <= e.EndS + s.SymptomWindowS)
                {
                    symptoms[i].Add(k);
                }
            }

            if (symptoms[i].Count > 0)
            {
                reasons[i].Add("symptom");
            }

            if (e.Confidence < s.LowConfidence)
            {
                reasons[i].Add("low-confidence");
            }

            if (e.Kind == EpisodeKinds.Pause && e.Highlighted)
            {
                reasons[i].Add("long-pause");
            }
        }

        foreach (var kind in episodes.Select(e => e.Kind).Distinct())
        {
            var members = Enumerable.Range(0, episodes.Count).Where(i => episodes[i].Kind == kind).ToList();
            reasons[members.MinBy(i => episodes[i].StartS)].Add("first-onset");
            reasons[members.MaxBy(i => episodes[i].DurationS)].Add("longest");
            if (kind == EpisodeKinds.Bradycardia)
            {
                var slowest = members.Where(i => !double.IsNaN(episodes[i].MinBpm)).DefaultIfEmpty(-1).MinBy(i => i < 0 ? 0 : episodes[i].MinBpm);
                if (slowest >= 0)
                {
                    reasons[slowest].Add("slowest");
                }
            }
            else if (!s_noRate.Contains(kind))
            {
                var fastest = members.Where(i => !double.IsNaN(episodes[i].MaxBpm)).DefaultIfEmpty(-1).MaxBy(i => i < 0 ? 0 : episodes[i].MaxBpm);
                if (fastest >= 0)
                {
                    reasons[fastest].Add("fastest");
                }
            }
        }

        var result = new List<Episode>(episodes.Count);
        for (var i = 0; i < episodes.Count; i++)
        {
            var e = episodes[i];
            var (onset, offset) = Strips(e, durationS, s.StripContextS);
            result.Add(e with { Reasons = reasons[i], SymptomEvents = symptoms[i], OnsetStrip = onset, OffsetStrip = offset });
        }

        result = Group(result, s.GroupGapS);
        return RankAll(result);
    }

    private static (Strip, Strip) Strips(Episode e, double durationS, double contextS)
    {
        Strip Clip(double a, double b) => new(Math.Max(0, a), Math.Min(durationS, b));
        if (e.DurationS <= 2 * contextS)
        {
            var one = Clip(e.StartS - contextS, e.EndS + contextS);
            return (one, one);
        }

        return (Clip(e.StartS - contextS, e.StartS + contextS), Clip(e.EndS - contextS, e.EndS + contextS));
    }

    // Episodes carry their ids already (time order).
    private static List<Episode> Group(List<Episode> episodes, double gapS)
    {
        var group = new int[episodes.Count];
        var size = new int[episodes.Count];
        foreach (var kind in episodes.Select(e => e.Kind).Distinct())
        {
            var members = Enumerable.Range(0, episodes.Count).Where(i => episodes[i].Kind == kind).ToList();
            var start = 0;
            while (start < members.Count)
            {
                var end = start;
                while (end + 1 < members.Count && episodes[members[end + 1]].StartS - episodes[members[end]].EndS <= gapS)
                {
                    end++;
                }

                var span = members.GetRange(start, end - start + 1);
                var representative = span.OrderByDescending(i => episodes[i].Reasons.Count).ThenByDescending(i => episodes[i].DurationS).First();
                foreach (var i in span)
                {
                    group[i] = episodes[representative].Id;
                    size[i] = span.Count;
                }

                start = end + 1;
            }
        }

        return episodes.Select((e, i) => e with { Group = group[i], GroupSize = size[i] }).ToList();
    }

    private static List<Episode> RankAll(List<Episode> episodes)
    {
        var order = episodes
            .OrderByDescending(e => e.Flagged)
            .ThenByDescending(e => e.Urgent)
            .ThenByDescending(e => e.Reasons.Contains("broad-complex"))
            .ThenByDescending(e => e.Reasons.Contains("symptom"))
            .ThenByDescending(e => e.Reasons.Count)
            .ThenByDescending(e => e.DurationS)
            .ThenBy(e => e.StartS)
            .Select((e, rank) => (e.Id, Rank: rank + 1))
            .ToDictionary(x => x.Id, x => x.Rank);
        return episodes.Select(e => e with { Rank = order[e.Id] }).ToList();
    }
}
