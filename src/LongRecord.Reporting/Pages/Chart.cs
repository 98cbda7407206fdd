using System.Globalization;
using LongRecord.Reporting.Drawing;
using SkiaSharp;

namespace LongRecord.Reporting.Pages;

/// <summary>A plot frame: title, y axis with unit and grid lines, and (for trend plots) the time axis' ticks.</summary>
public sealed class Chart(Painter p, SKRect plot, double yMin, double yMax)
{
    public const float TickPt = 6.5f;

    public SKRect Plot { get; } = plot;

    public float Y(double v) => Plot.Bottom - (float)((Math.Clamp(v, yMin, yMax) - yMin) / (yMax - yMin) * Plot.Height);

    /// <summary>Frame, title above the plot, y labels every <paramref name="yStep"/> with the unit in the title.</summary>
    public void Frame(string title, double yStep, string format = "0")
    {
        p.Text(title, Plot.Left - 12, Plot.Top - 1.8f, 8.5f, Ink.Text, bold: true);
        for (var v = Math.Ceiling(yMin / yStep) * yStep; v <= yMax + 1e-9; v += yStep)
        {
            var y = Y(v);
            p.Line(Plot.Left, y, Plot.Right, y, Ink.Panel, 0.2f);
            p.Text(v.ToString(format, CultureInfo.InvariantCulture), Plot.Left - 1.2f, y + 0.9f, TickPt, Ink.Muted, align: SKTextAlign.Right);
        }

        p.Frame(Plot, Ink.Rule, 0.2f);
    }

    /// <summary>Vertical tick lines through the plot and labels under it.</summary>
    public void TimeTicks(TimeAxis axis, bool labels)
    {
        foreach (var (s, label) in axis.Ticks())
        {
            var x = axis.X(s);
            p.Line(x, Plot.Top, x, Plot.Bottom, Ink.Panel, 0.2f);
            p.Line(x, Plot.Bottom, x, Plot.Bottom + 0.8f, Ink.Muted, 0.2f);
            if (labels)
            {
                p.Text(label, x, Plot.Bottom + 3.2f, TickPt, Ink.Muted, align: SKTextAlign.Center);
            }
        }

        p.Frame(Plot, Ink.Rule, 0.2f);
    }

    /// <summary>A "nice" step (1, 2 or 5 × 10ⁿ) giving about <paramref name="lines"/> grid lines over <paramref name="range"/>.</summary>
    public static double NiceStep(double range, int lines)
    {
        var raw = range / Math.Max(1, lines);
        var mag = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        var n = raw / mag;
        return (n <= 1 ? 1 : n <= 2 ? 2 : n <= 5 ? 5 : 10) * mag;
    }
}
