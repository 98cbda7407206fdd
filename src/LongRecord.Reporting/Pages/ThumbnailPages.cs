using LongRecord.Reporting.Drawing;
using LongRecord.Reporting.Strips;
using SkiaSharp;
using static LongRecord.Reporting.Pages.ReportText;

namespace LongRecord.Reporting.Pages;

/// <summary>Thumbnails of every flagged episode, ten to a page, for skimming: onset and end, beat labels, rate.</summary>
public sealed class ThumbnailPages : IReportSection
{
    private const float HeadingMm = 4.6f;
    private const float PaperMm = 20;
    private const float GapMm = 2.8f;
    private static float RowMm => HeadingMm + StripPanel.LabelBandMm + PaperMm + GapMm;

    private IReadOnlyList<Thumbnail>? _plan;

    public string Title => "Episode thumbnails";

    public int PageCount(ReportContext c)
    {
        var n = Plan(c).Count;
        return n == 0 ? 0 : (int)Math.Ceiling(n / (double)PerPage(c));
    }

    public void DrawPage(ReportContext c, int page)
    {
        var p = c.P;
        var left = ReportContext.MarginMm;
        var y = ReportContext.BodyTopMm + 5;
        var plan = Plan(c);
        var flagged = c.Model.Episodes.Count(e => e.Flagged);
        p.Text("Flagged episodes at a glance", left, y, 11, Ink.Text, bold: true);
        var capped = plan.Count < flagged ? $"; this template draws the first {Count(plan.Count)} of {Count(flagged)}" : "";
        p.Text($"first lead, {StripScale.Thumbnail.Caption}, grid 0.2 s × 0.5 mV{capped}", left + c.BodyWidthMm, y + 4.5f, 7, Ink.Muted, align: SKTextAlign.Right);
        y += 7;
        var half = (c.BodyWidthMm - 3) / 2;
        foreach (var t in plan.Skip(page * PerPage(c)).Take(PerPage(c)))
        {
            var e = t.Episode;
            var head = $"{Count(e.Rank)}. {Kind(e.Kind)}";
            var w = p.Text(head, left, y + 3.4f, 8, e.Urgent ? Ink.Flag : Ink.Text, bold: true);
            p.Text(p.Fit(StripPlan.EpisodeDetail(c.Model.Recording.Start, e) + (e.Urgent ? " · URGENT" : ""), c.BodyWidthMm - w - 3, 7.5f), left + w + 2, y + 3.4f, 7.5f, Ink.Muted);
            var top = y + HeadingMm;
            for (var i = 0; i < t.Panels.Count; i++)
            {
                var width = t.Panels.Count == 1 ? c.BodyWidthMm : half;
                var x = left + i * (half + 3);
                var area = new SKRect(x, top, x + width, top + StripPanel.LabelBandMm + PaperMm);
                Panel(c, area, t.Panels[i]);
            }

            y += RowMm;
        }
    }

    private static void Panel(ReportContext c, SKRect area, StripWindow w)
    {
        if (c.Strips is null)
        {
            return;
        }

        var signal = c.Strips.Read(w.StartS, w.DurationS);
        var one = FirstLead(signal);
        StripPanel.Draw(c.P, c.Renderer, area, one, StripScale.Thumbnail, w.Markers, calibration: false, fineStepMm: 2.5f, labelPt: 6, c.Strips.LeadLabels.Take(1).ToArray());
    }

    // Thumbnails show the first lead only; the full-size strips show every lead.
    private static Model.StripSignal FirstLead(Model.StripSignal s)
    {
        if (s.Leads == 1)
        {
            return s;
        }

        var one = new Model.StripSignal(1, s.Count);
        one.Reset(s.StartS, s.SamplingRateHz, s.Count);
        s.Lead(0).CopyTo(one.Samples);
        one.Beats.AddRange(s.Beats);
        return one;
    }

    private IReadOnlyList<Thumbnail> Plan(ReportContext c)
    {
        var panelS = StripPanel.SecondsFor((c.BodyWidthMm - 3) / 2, StripScale.Thumbnail, calibration: false);
        return _plan ??= c.Strips is null ? [] : StripPlan.Thumbnails(c.Model, c.Template, panelS);
    }

    private static int PerPage(ReportContext c) => (int)((c.BodyBottomMm - ReportContext.BodyTopMm - 12) / RowMm);
}
