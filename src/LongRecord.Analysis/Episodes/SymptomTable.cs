namespace LongRecord.Analysis.Episodes;

/// <summary>The rhythm and rate at each symptom event: episodes and analysable beats within ± the symptom window.</summary>
internal static class SymptomTable
{
    public static List<SymptomEvent> Build(IReadOnlyList<SymptomEventInput> events, IReadOnlyList<Episode> episodes, BeatTrack t, DateTime? start,
        double windowS, int averagingBeats)
    {
        var table = new List<SymptomEvent>();
        foreach (var ev in events.OrderBy(e => e.TimeS))
        {
            var from = ev.TimeS - windowS;
            var to = ev.TimeS + windowS;
            var near = episodes.Where(e => e.StartS <= to && e.EndS >= from).ToList();
            var first = t.FirstAtOrAfter(from);
            var last = t.LastAtOrBefore(to);
            var mean = last > first ? t.MeanBpm(first, last) : double.NaN;
            var (max, min) = last > first ? t.Extremes(first, last, averagingBeats) : (double.NaN, double.NaN);
            var rhythm = near.Count > 0
                ? string.Join('+', near.OrderByDescending(e => e.Urgent).ThenBy(e => e.StartS).Select(e => e.Kind).Distinct())
                : double.IsNaN(mean) ? "no-beats" : "no-episode";
            table.Add(new SymptomEvent(ev.TimeS, start?.AddSeconds(ev.TimeS), ev.Text, ev.Source, rhythm, mean, min, max, near.Select(e => e.Id).ToList()));
        }

        return table;
    }
}
