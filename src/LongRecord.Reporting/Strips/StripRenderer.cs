using LongRecord.Reporting.Drawing;
using SkiaSharp;

namespace LongRecord.Reporting.Strips;

/// <summary>
/// Draws ECG strips on a canvas whose unit is the millimetre: the grid, the 1 mV × 200 ms calibration pulse, traces,
/// beat labels and episode markers. The PDF pages and the calibration tests use this same code.
/// </summary>
public sealed class StripRenderer : IDisposable
{
    // Traces are drawn on integer coordinates of 1/Precision mm: a 0.05 mm step is far below what print or screen
    // shows and keeps each point to a few characters in the PDF (common practice, no source).
    private const float Precision = 20f;

    private readonly SKPaint _fine = new() { IsAntialias = false, Style = SKPaintStyle.Stroke, Color = Ink.GridFine, StrokeWidth = 0.1f };
    private readonly SKPaint _bold = new() { IsAntialias = false, Style = SKPaintStyle.Stroke, Color = Ink.GridBold, StrokeWidth = 0.2f };
    private readonly SKPaint _trace = new() { IsAntialias = true, Style = SKPaintStyle.Stroke, Color = Ink.Trace, StrokeWidth = 0.25f * Precision, StrokeJoin = SKStrokeJoin.Round, StrokeCap = SKStrokeCap.Round };
    private readonly SKPaint _pulse = new() { IsAntialias = true, Style = SKPaintStyle.Stroke, Color = Ink.Trace, StrokeWidth = 0.25f, StrokeJoin = SKStrokeJoin.Miter };
    private readonly SKPath _path = new();

    /// <summary>Width of the calibration pulse block drawn before a trace: lead-in, 200 ms pulse, lead-out, mm at 25 mm/s.</summary>
    public static float CalibrationBlockMm(StripScale scale) => (float)(0.2 * scale.MmPerS) + 3f;

    /// <summary>
    /// The millimetre grid over <paramref name="area"/>: a line every <paramref name="fineStepMm"/> and a bolder one every
    /// five of them, counted from the area's top-left corner. Full strips use 1 mm and 5 mm.
    /// </summary>
    public void DrawGrid(SKCanvas canvas, SKRect area, float fineStepMm = 1f)
    {
        var nx = (int)MathF.Floor(area.Width / fineStepMm + 1e-3f);
        var ny = (int)MathF.Floor(area.Height / fineStepMm + 1e-3f);
        for (var pass = 0; pass < 2; pass++)
        {
            // Fine lines first, bold on top, so the 5 mm lines are never overdrawn.
            for (var i = 0; i <= nx; i++)
            {
                if ((i % 5 == 0) == (pass == 1))
                {
                    var x = area.Left + i * fineStepMm;
                    canvas.DrawLine(x, area.Top, x, area.Bottom, pass == 1 ? _bold : _fine);
                }
            }

            for (var j = 0; j <= ny; j++)
            {
                if ((j % 5 == 0) == (pass == 1))
                {
                    var y = area.Top + j * fineStepMm;
                    canvas.DrawLine(area.Left, y, area.Right, y, pass == 1 ? _bold : _fine);
                }
            }
        }
    }

    /// <summary>
    /// The calibration pulse: 1 mV for 200 ms from the baseline at <paramref name="baselineY"/>, starting 1 mm after
    /// <paramref name="x"/> (10 mm tall and 5 mm wide at 25 mm/s, 10 mm/mV). Returns the x just after it.
    /// </summary>
    public float DrawCalibrationPulse(SKCanvas canvas, float x, float baselineY, StripScale scale)
    {
        var w = (float)(0.2 * scale.MmPerS);
        var h = (float)(1.0 * scale.MmPerMv);
        _path.Reset();
        _path.MoveTo(x, baselineY);
        _path.LineTo(x + 1, baselineY);
        _path.LineTo(x + 1, baselineY - h);
        _path.LineTo(x + 1 + w, baselineY - h);
        _path.LineTo(x + 1 + w, baselineY);
        _path.LineTo(x + 2 + w, baselineY);
        canvas.DrawPath(_path, _pulse);
        return x + CalibrationBlockMm(scale);
    }

    /// <summary>
    /// One lead's samples from <paramref name="x"/> at the strip's scale, baseline (0 mV) at
    /// <paramref name="baselineY"/>. NaN samples (not recorded) break the line.
    /// </summary>
    public void DrawTrace(SKCanvas canvas, ReadOnlySpan<float> millivolts, double rateHz, float x, float baselineY, StripScale scale)
    {
        if (millivolts.Length == 0)
        {
            return;
        }

        var dx = (float)(scale.MmPerS / rateHz) * Precision;
        var gy = (float)scale.MmPerMv * Precision;
        var x0 = x * Precision;
        var y0 = baselineY * Precision;
        _path.Reset();
        var pen = false;
        var lastX = int.MinValue;
        var lastY = int.MinValue;
        for (var i = 0; i < millivolts.Length; i++)
        {
            var v = millivolts[i];
            if (float.IsNaN(v))
            {
                pen = false;
                continue;
            }

            var px = (int)MathF.Round(x0 + i * dx);
            var py = (int)MathF.Round(y0 - v * gy);
            if (!pen)
            {
                _path.MoveTo(px, py);
                pen = true;
            }
            else if (px != lastX || py != lastY)
            {
                _path.LineTo(px, py);
            }

            lastX = px;
            lastY = py;
        }

        canvas.Save();
        canvas.Scale(1 / Precision);
        canvas.DrawPath(_path, _trace);
        canvas.Restore();
    }

    public void Dispose()
    {
        _fine.Dispose();
        _bold.Dispose();
        _trace.Dispose();
        _pulse.Dispose();
        _path.Dispose();
    }
}
