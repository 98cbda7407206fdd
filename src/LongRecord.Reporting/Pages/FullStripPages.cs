using LongRecord.Reporting.Drawing;
using LongRecord.Reporting.Strips;
using SkiaSharp;

namespace LongRecord.Reporting.Pages;

/// <summary>
/// Full-size strips at 25 mm/s and 10 mm/mV on a 1 mm / 5 mm grid, every lead, a 1 mV calibration pulse before each:
/// the most important flagged episodes, then the slowest and fastest rate, the longest pause and each patient event.
/// </summary>
public sealed class FullStripPages : IReportSection
{
    private const float HeadingMm = 6.5f;
    private const float GapMm = 4;

    private IReadOnlyList<FullStrip>? _plan;

    public string Title => "Strips";

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
        p.Text("Strips", left, y, 11, Ink.Text, bold: true);
        p.Text($"{StripScale.Full.Caption}; grid 1 mm = 40 ms × 0.1 mV, 5 mm = 200 ms × 0.5 mV; calibration pulse 1 mV, 200 ms; conditioned 0.5 Hz high-pass", left + c.BodyWidthMm, y + 4.5f, 7, Ink.Muted, align: SKTextAlign.Right);
        y += 6;
        foreach (var s in Plan(c).Skip(page * PerPage(c)).Take(PerPage(c)))
        {
            var w = p.Text(p.Fit(s.Heading, 90, 8.5f, bold: true), left, y + 4.2f, 8.5f, Ink.Text, bold: true);
            p.Text(p.Fit(s.Detail, c.BodyWidthMm - w - 3, 7.5f), left + w + 2.5f, y + 4.2f, 7.5f, Ink.Muted);
            var area = new SKRect(left, y + HeadingMm, left + StripWidthMm(c), y + HeadingMm + StripPanel.LabelBandMm + PaperMm(c));
            var signal = c.Strips!.Read(s.Window.StartS, s.Window.DurationS);
            StripPanel.Draw(p, c.Renderer, area, signal, StripScale.Full, s.Window.Markers, calibration: true, fineStepMm: 1, labelPt: 7, c.Strips.LeadLabels);
            y += BlockMm(c);
        }
    }

    /// <summary>Grid height: 25 mm (±1.25 mV about the baseline) per lead up to two leads, 20 mm each for three.</summary>
    private static float PaperMm(ReportContext c) => c.Strips!.LeadLabels.Count switch
    {
        <= 1 => 25,
        2 => 50,
        var n => 20 * n,
    };

    // A whole number of 5 mm squares across.
    private static float StripWidthMm(ReportContext c) => MathF.Floor(c.BodyWidthMm / 5) * 5;

    private static float BlockMm(ReportContext c) => HeadingMm + StripPanel.LabelBandMm + PaperMm(c) + GapMm;

    private static int PerPage(ReportContext c) => Math.Max(1, (int)((c.BodyBottomMm - ReportContext.BodyTopMm - 6) / BlockMm(c)));

    private IReadOnlyList<FullStrip> Plan(ReportContext c)
    {
        if (_plan is not null)
        {
            return _plan;
        }

        var seconds = StripPanel.SecondsFor(StripWidthMm(c), StripScale.Full, calibration: true);
        return _plan = c.Strips is null ? [] : StripPlan.Full(c.Model, c.Template, seconds);
    }
}
