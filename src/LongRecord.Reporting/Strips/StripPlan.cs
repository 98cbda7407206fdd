using LongRecord.Reporting.Model;
using LongRecord.Reporting.Templates;
using static LongRecord.Reporting.Pages.ReportText;

namespace LongRecord.Reporting.Strips;

/// <summary>
/// Which strips the report draws. Thumbnails: every flagged episode in rank order (the template may cap how many are
/// drawn, never which episodes count as flagged). Full size: the top-ranked flagged episodes, then the reference
/// moments — slowest and fastest rate, longest pause, each patient event.
/// </summary>
public static class StripPlan
{
    /// <summary>Signal before an onset (and after an end) shown in a window, s (common practice, no source).</summary>
    public const double LeadInS = 2.0;

    public static IReadOnlyList<Thumbnail> Thumbnails(ReportModel model, ReportTemplate template, double panelS)
    {
        var list = new List<Thumbnail>();
        foreach (var e in model.Episodes.Where(e => e.Flagged).Take(template.ThumbnailStrips))
        {
            var onset = new StripMarker(e.StartS, e.OnsetObserved ? "onset" : "onset not seen");
            var end = new StripMarker(e.EndS, e.OffsetObserved ? "end" : "end not seen");
            if (e.DurationS <= 2 * panelS - 2 * LeadInS)
            {
                // Short: one window as wide as two panels, centred on the episode.
                var centre = (e.StartS + e.EndS) / 2;
                list.Add(new Thumbnail(e, [new StripWindow(Math.Max(0, centre - panelS), 2 * panelS, [onset, end])]));
            }
            else
            {
                list.Add(new Thumbnail(e,
                [
                    new StripWindow(Math.Max(0, e.StartS - LeadInS), panelS, [onset]),
                    new StripWindow(Math.Max(0, e.EndS + LeadInS - panelS), panelS, [end]),
                ]));
            }
        }

        return list;
    }

    public static IReadOnlyList<FullStrip> Full(ReportModel model, ReportTemplate template, double stripS)
    {
        var list = new List<FullStrip>();
        DateTime? start = model.Recording.Start;
        foreach (var e in model.Episodes.Where(e => e.Flagged).Take(template.FullStrips))
        {
            var window = e.DurationS <= stripS - 2 * LeadInS
                ? new StripWindow(Math.Max(0, (e.StartS + e.EndS - stripS) / 2), stripS, [new(e.StartS, "onset"), new(e.EndS, "end")])
                : new StripWindow(Math.Max(0, e.StartS - LeadInS), stripS, [new(e.StartS, e.OnsetObserved ? "onset" : "onset not seen")]);
            list.Add(new FullStrip($"Episode {Count(e.Rank)}: {Kind(e.Kind)}", EpisodeDetail(start, e), window));
        }

        if (!template.ReferenceStrips)
        {
            return list;
        }

        var f = model.Figures;
        if (f.Slowest is { } slow)
        {
            list.Add(new FullStrip("Slowest rate", $"{Number(slow.Bpm, 1, "bpm")} (8-beat average) at {Moment(start, slow.StartS)}", Around(slow.StartS, slow.EndS, stripS, "slowest")));
        }

        if (f.Fastest is { } fast)
        {
            list.Add(new FullStrip("Fastest rate", $"{Number(fast.Bpm, 1, "bpm")} (8-beat average) at {Moment(start, fast.StartS)}", Around(fast.StartS, fast.EndS, stripS, "fastest")));
        }

        var pause = model.Episodes.Where(e => e.Kind == "pause").OrderByDescending(e => e.DurationS).FirstOrDefault();
        if (pause is not null)
        {
            list.Add(new FullStrip("Longest pause", $"{Number(pause.DurationS, 2, "s")} at {Moment(start, pause.StartS)}",
                new StripWindow(Math.Max(0, (pause.StartS + pause.EndS - stripS) / 2), stripS, [new(pause.StartS, "pause"), new(pause.EndS, "end")])));
        }

        foreach (var s in model.Symptoms.Take(template.EventStrips))
        {
            list.Add(new FullStrip($"Patient event: {s.Text}", $"at {Moment(start, s.TimeS)}; rhythm found: {s.Rhythm}; rate {Number(s.RateBpm, 0, "bpm")}",
                new StripWindow(Math.Max(0, s.TimeS - stripS / 2), stripS, [new(s.TimeS, "event")])));
        }

        return list;
    }

    public static string EpisodeDetail(DateTime? start, ReportEpisode e) =>
        $"{Moment(start, e.StartS)}, {Duration(e.DurationS)}, {Count(e.Beats)} beats, mean {Number(e.RateBpm, 0, "bpm")}" +
        (e.Regularity.Length > 0 ? $", {e.Regularity}" : "") + (e.QrsClass.Length > 0 ? $", {e.QrsClass} QRS" : "");

    // A window centred on a rate period (an 8-beat average), markers at its first and last beat.
    private static StripWindow Around(double startS, double endS, double stripS, string word) =>
        new(Math.Max(0, (startS + endS - stripS) / 2), stripS, [new(startS, word)]);
}
