using LongRecord.Reporting.Drawing;
using LongRecord.Reporting.Model;
using SkiaSharp;

namespace LongRecord.Reporting.Strips;

/// <summary>
/// One strip window laid out in a rectangle: grid, a calibration pulse before each lead, the leads one above the other,
/// beat labels along the top edge and labelled markers. Everything is clipped to the rectangle.
/// </summary>
public static class StripPanel
{
    /// <summary>Height reserved at the top of the rectangle for beat labels, mm.</summary>
    public const float LabelBandMm = 3.2f;

    /// <summary>Seconds of signal that fit in <paramref name="widthMm"/> after the calibration block.</summary>
    public static double SecondsFor(float widthMm, StripScale scale, bool calibration) =>
        (widthMm - (calibration ? StripRenderer.CalibrationBlockMm(scale) : 0)) / scale.MmPerS;

    public static void Draw(Painter p, StripRenderer r, SKRect area, StripSignal signal, StripScale scale, IReadOnlyList<StripMarker> markers, bool calibration, float fineStepMm, float labelPt, IReadOnlyList<string> leadLabels)
    {
        var c = p.Canvas;
        c.Save();
        c.ClipRect(area);
        var paper = new SKRect(area.Left, area.Top + LabelBandMm, area.Right, area.Bottom);
        r.DrawGrid(c, paper, fineStepMm);
        var x0 = paper.Left + (calibration ? StripRenderer.CalibrationBlockMm(scale) : 0);
        var band = paper.Height / Math.Max(1, signal.Leads);
        for (var k = 0; k < signal.Leads; k++)
        {
            // Baseline a little below the band's middle: QRS complexes mostly rise from it.
            var baseline = paper.Top + band * (k + 0.6f);
            if (calibration)
            {
                r.DrawCalibrationPulse(c, paper.Left, baseline, scale);
            }

            r.DrawTrace(c, signal.Lead(k), signal.SamplingRateHz, x0, baseline, scale);
            if (k < leadLabels.Count)
            {
                var labelX = x0 + 1;
                var labelY = paper.Top + band * k + Mm.FromPoints(labelPt) + 0.8f;
                var w = p.Measure(leadLabels[k], labelPt, bold: true);
                p.Box(new SKRect(labelX - 0.5f, labelY - Mm.FromPoints(labelPt), labelX + w + 0.5f, labelY + 0.6f), SKColors.White);
                p.Text(leadLabels[k], labelX, labelY, labelPt, Ink.Accent, bold: true);
            }
        }

        foreach (var b in signal.Beats)
        {
            var x = x0 + (float)((b.TimeS - signal.StartS) * scale.MmPerS);
            if (x < x0 || x > area.Right)
            {
                continue;
            }

            var color = b.Label == 'N' ? Ink.Muted : Ink.Flag;
            p.Text(b.Label.ToString(), x, area.Top + LabelBandMm - 0.7f, labelPt, color, bold: b.Label != 'N', align: SKTextAlign.Center);
        }

        foreach (var m in markers)
        {
            var x = x0 + (float)((m.TimeS - signal.StartS) * scale.MmPerS);
            if (x < x0 || x > area.Right)
            {
                continue;
            }

            p.DashedLine(x, paper.Top, x, paper.Bottom, Ink.Accent, 0.3f);
            var w = p.Measure(m.Label, labelPt, bold: true);
            // Keep the marker's word inside the strip: to the left of the line when it would run off the right edge.
            var left = x + 0.8f + w > area.Right ? x - 0.8f - w : x + 0.8f;
            var y = paper.Bottom - 1.2f;
            p.Box(new SKRect(left - 0.4f, y - Mm.FromPoints(labelPt), left + w + 0.4f, y + 0.7f), SKColors.White);
            p.Text(m.Label, left, y, labelPt, Ink.Accent, bold: true);
        }

        c.Restore();
        p.Frame(area, Ink.Rule, 0.2f);
    }
}
