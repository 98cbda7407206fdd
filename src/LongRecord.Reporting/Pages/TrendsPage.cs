using LongRecord.Reporting.Drawing;
using LongRecord.Reporting.Model;
using SkiaSharp;

namespace LongRecord.Reporting.Pages;

/// <summary>
/// Trends over the whole recording on one clock-time axis (hourly rate band, AF burden, analysable share, RR
/// tachogram), then the RR scatter (each RR against the next) and the heart-rate histogram.
/// </summary>
public sealed class TrendsPage : IReportSection
{
    private const float AxisLeftMm = 14;

    public string Title => "Trends";

    public int PageCount(ReportContext context) => 1;

    public void DrawPage(ReportContext c, int page)
    {
        var p = c.P;
        var m = c.Model;
        var left = ReportContext.MarginMm + AxisLeftMm;
        var axis = new TimeAxis(m.Recording.Start, m.Recording.DurationS, left, c.BodyWidthMm - AxisLeftMm - 1);
        var y = ReportContext.BodyTopMm + 6;

        // Hourly rate: band from the lowest to the highest averaged rate, mean as a line; gaps where the hour was not sufficient.
        var rate = new Chart(p, new SKRect(axis.Left, y, axis.Right, y + 50), 20, RateCeiling(m));
        rate.Frame("Heart rate per hour, bpm: band lowest to highest (8-beat average), line mean", 20);
        rate.TimeTicks(axis, labels: true);
        foreach (var h in m.Hours.Where(h => h.Sufficient))
        {
            var x0 = axis.X(h.StartS) + 0.3f;
            var x1 = axis.X(h.EndS) - 0.3f;
            p.Box(new SKRect(x0, rate.Y(h.MaxBpm), x1, rate.Y(h.MinBpm)), Ink.RateBand);
            p.Line(x0, rate.Y(h.MeanBpm), x1, rate.Y(h.MeanBpm), Ink.Rate, 0.5f);
        }

        NotSufficient(c, rate, axis);
        y += 50 + 10;

        var af = new Chart(p, new SKRect(axis.Left, y, axis.Right, y + 18), 0, 100);
        af.Frame("AF burden per hour, % of analysable time", 50);
        af.TimeTicks(axis, labels: false);
        foreach (var h in m.Hours.Where(h => double.IsFinite(h.AfBurdenPercent) && h.AfBurdenPercent > 0))
        {
            p.Box(new SKRect(axis.X(h.StartS) + 0.3f, af.Y(h.AfBurdenPercent), axis.X(h.EndS) - 0.3f, af.Y(0)), Ink.Af);
        }

        y += 18 + 8;
        var ok = new Chart(p, new SKRect(axis.Left, y, axis.Right, y + 18), 0, 100);
        ok.Frame("Analysable signal per hour, %", 50);
        ok.TimeTicks(axis, labels: false);
        foreach (var h in m.Hours)
        {
            p.Box(new SKRect(axis.X(h.StartS) + 0.3f, ok.Y(h.AnalysablePercent), axis.X(h.EndS) - 0.3f, ok.Y(0)), h.Sufficient ? Ink.Analysable : Ink.Caution);
        }

        y += 18 + 8;
        Tachogram(c, axis, new SKRect(axis.Left, y, axis.Right, y + 38));
        y += 38 + 4;
        p.Text($"Time axis: {axis.Caption}. Hours with less than half their time analysable show no rate (hatched).", axis.Left, y + 2, 7, Ink.Muted);
        y += 11;

        var size = Math.Min(c.BodyBottomMm - y - 9, 78);
        Scatter(c, new SKRect(axis.Left, y, axis.Left + size, y + size));
        var hx = axis.Left + size + 22;
        Histogram(c, new SKRect(hx, y, axis.Right, y + size));
    }

    private static double RateCeiling(ReportModel m)
    {
        var top = m.Hours.Where(h => h.Sufficient && double.IsFinite(h.MaxBpm)).Select(h => h.MaxBpm).DefaultIfEmpty(100).Max();
        return Math.Max(120, Math.Ceiling((top + 10) / 20) * 20);
    }

    private static void NotSufficient(ReportContext c, Chart chart, TimeAxis axis)
    {
        foreach (var h in c.Model.Hours.Where(h => !h.Sufficient))
        {
            var x0 = axis.X(h.StartS);
            var x1 = axis.X(h.EndS);
            for (var x = x0 + 1; x < x1; x += 1.5f)
            {
                c.P.Line(x, chart.Plot.Bottom - 0.3f, Math.Min(x1, x + 4), chart.Plot.Bottom - 4.3f, Ink.Rule, 0.15f);
            }
        }
    }

    private static void Tachogram(ReportContext c, TimeAxis axis, SKRect plot)
    {
        var p = c.P;
        var d = c.Model.Distributions;
        var chart = new Chart(p, plot, 200, 2000);
        chart.Frame(string.Create(System.Globalization.CultureInfo.InvariantCulture, $"RR tachogram, ms: per {d.TachogramBinS:0} s, line lowest to highest, dot mean"), 400);
        chart.TimeTicks(axis, labels: true);
        using var path = new SKPath();
        for (var i = 0; i < d.RrMeanMs.Length; i++)
        {
            if (float.IsNaN(d.RrMeanMs[i]))
            {
                continue;
            }

            var x = axis.X((i + 0.5) * d.TachogramBinS);
            path.MoveTo(x, chart.Y(d.RrMinMs[i]));
            path.LineTo(x, chart.Y(d.RrMaxMs[i]));
        }

        // One vertical line per bin, as wide as the bin up to half a millimetre (short recordings have few bins).
        p.Path(path, Ink.RateBand, Math.Clamp(axis.Width / Math.Max(1, d.RrMeanMs.Length), 0.12f, 0.5f));
        path.Reset();
        for (var i = 0; i < d.RrMeanMs.Length; i++)
        {
            if (!float.IsNaN(d.RrMeanMs[i]))
            {
                var x = axis.X((i + 0.5) * d.TachogramBinS);
                var y = chart.Y(d.RrMeanMs[i]);
                path.MoveTo(x, y);
                path.LineTo(x + 0.01f, y);
            }
        }

        p.Path(path, Ink.Rate, 0.45f);
    }

    private static void Scatter(ReportContext c, SKRect plot)
    {
        var p = c.P;
        var d = c.Model.Distributions;
        var top = d.ScatterMinMs + d.ScatterStepMs * d.ScatterBins;
        var chart = new Chart(p, plot, d.ScatterMinMs, top);
        chart.Frame("RR scatter: RR(n+1) against RR(n), ms", 400);
        var max = d.ScatterCounts.DefaultIfEmpty(0).Max();
        var cell = plot.Width / d.ScatterBins;
        for (var i = 0; i < d.ScatterBins && max > 0; i++)
        {
            for (var j = 0; j < d.ScatterBins; j++)
            {
                var n = d.ScatterCounts[i * d.ScatterBins + j];
                if (n == 0)
                {
                    continue;
                }

                // Log shading: one interval must stay visible beside a hundred thousand.
                var t = 0.25 + 0.75 * Math.Log(1 + n) / Math.Log(1 + max);
                var color = Blend(Ink.RateBand, Ink.Text, (float)t);
                p.Box(new SKRect(plot.Left + i * cell, plot.Bottom - (j + 1) * cell, plot.Left + (i + 1) * cell, plot.Bottom - j * cell), color);
            }
        }

        p.Line(plot.Left, plot.Bottom, plot.Right, plot.Top, Ink.Rule, 0.15f);
        for (var v = 400.0; v < top; v += 400)
        {
            var x = plot.Left + (float)((v - d.ScatterMinMs) / (top - d.ScatterMinMs) * plot.Width);
            p.Text(v.ToString("0", System.Globalization.CultureInfo.InvariantCulture), x, plot.Bottom + 3.2f, Chart.TickPt, Ink.Muted, align: SKTextAlign.Center);
        }

        p.Text("RR(n), ms", plot.MidX, plot.Bottom + 6.6f, Chart.TickPt, Ink.Muted, align: SKTextAlign.Center);
    }

    private static void Histogram(ReportContext c, SKRect plot)
    {
        var p = c.P;
        var d = c.Model.Distributions;
        var max = d.HistogramCounts.DefaultIfEmpty(0).Max();
        var yMax = max == 0 ? 10 : Chart.NiceStep(max, 4) * Math.Ceiling(max / Chart.NiceStep(max, 4));
        var chart = new Chart(p, plot, 0, yMax);
        var step = Chart.NiceStep(yMax, 4);
        chart.Frame("Heart rate histogram, beats per " + d.HistogramStepBpm.ToString("0", System.Globalization.CultureInfo.InvariantCulture) + " bpm", step, step >= 1000 ? "#,0" : "0");
        var lo = d.HistogramMinBpm;
        var hi = lo + d.HistogramStepBpm * d.HistogramCounts.Length;
        float X(double bpm) => plot.Left + (float)((bpm - lo) / (hi - lo) * plot.Width);
        for (var i = 0; i < d.HistogramCounts.Length; i++)
        {
            if (d.HistogramCounts[i] > 0)
            {
                p.Box(new SKRect(X(lo + i * d.HistogramStepBpm) + 0.1f, chart.Y(d.HistogramCounts[i]), X(lo + (i + 1) * d.HistogramStepBpm) - 0.1f, plot.Bottom), Ink.Rate);
            }
        }

        for (var bpm = Math.Ceiling(lo / 40) * 40; bpm <= hi; bpm += 40)
        {
            p.Text(bpm.ToString("0", System.Globalization.CultureInfo.InvariantCulture), X(bpm), plot.Bottom + 3.2f, Chart.TickPt, Ink.Muted, align: SKTextAlign.Center);
        }

        p.Text("beat-to-beat heart rate, bpm", plot.MidX, plot.Bottom + 6.6f, Chart.TickPt, Ink.Muted, align: SKTextAlign.Center);
    }

    private static SKColor Blend(SKColor a, SKColor b, float t) => new(
        (byte)(a.Red + (b.Red - a.Red) * t), (byte)(a.Green + (b.Green - a.Green) * t), (byte)(a.Blue + (b.Blue - a.Blue) * t));
}
