using LongRecord.Reporting.Drawing;
using LongRecord.Reporting.Strips;
using SkiaSharp;

namespace LongRecord.Reporting.Tests.Strips;

/// <summary>
/// Paper speed 25 mm/s and gain 10 mm/mV with a 1 mm / 5 mm grid are the trade's conventions for ECG strips (the
/// standard recording speed and gain of IEC 60601-2-25 and the ambulatory IEC 60601-2-47; from memory). Everything is
/// drawn through <see cref="StripRenderer"/>, the code the PDF pages use, rasterised at 20 pixels per millimetre.
/// </summary>
public sealed class StripCalibrationTests
{
    private const int PxPerMm = 20;

    // Tolerance 0.5 mm, as the report issue states; the 0.25 mm stroke adds at most 0.25 mm to an outer measure.
    private const double ToleranceMm = 0.5;

    [Fact]
    public void CalibrationPulse_OneMillivoltFor200Ms_Is10MmTallAnd5MmWide()
    {
        using var bitmap = Raster(30, 20, (c, r) => r.DrawCalibrationPulse(c, 2, 15, StripScale.Full));
        var (left, top, right, bottom) = DarkBounds(bitmap);
        var heightMm = (bottom - top + 1) / (double)PxPerMm;
        // The pulse's flat top: dark pixels on the row just below its upper edge.
        var topRow = top + 2;
        var plateau = Enumerable.Range(0, bitmap.Width).Where(x => Dark(bitmap.GetPixel(x, topRow))).ToArray();
        var widthMm = (plateau.Max() - plateau.Min() + 1) / (double)PxPerMm;
        Assert.Equal(10.0, heightMm, ToleranceMm);
        Assert.Equal(5.0, widthMm, ToleranceMm);
        // Lead-in and lead-out of 1 mm each on the baseline: the whole block is 7 mm wide.
        Assert.Equal(7.0, (right - left + 1) / (double)PxPerMm, ToleranceMm);
    }

    [Fact]
    public void Trace_OneMillivoltStepFor200Ms_Is10MmTallAnd5MmWide()
    {
        // 250 Hz: 0.2 s of 1 mV is 50 samples, between 0 mV baselines (the same pulse drawn as a signal).
        var samples = new float[150];
        for (var i = 50; i < 100; i++)
        {
            samples[i] = 1f;
        }

        using var bitmap = Raster(30, 20, (c, r) => r.DrawTrace(c, samples, 250, 2, 15, StripScale.Full));
        var (_, top, _, bottom) = DarkBounds(bitmap);
        var plateau = Enumerable.Range(0, bitmap.Width).Where(x => Dark(bitmap.GetPixel(x, top + 2))).ToArray();
        Assert.Equal(10.0, (bottom - top + 1) / (double)PxPerMm, ToleranceMm);
        // 49 sample steps of 4 ms from the first 1 mV sample to the last: 196 ms = 4.9 mm, plus the stroke.
        Assert.Equal(5.0, (plateau.Max() - plateau.Min() + 1) / (double)PxPerMm, ToleranceMm);
    }

    [Fact]
    public void Grid_HasFineLinesEveryMillimetreAndBoldLinesEveryFive()
    {
        using var bitmap = Raster(21, 21, (c, r) => r.DrawGrid(c, new SKRect(0.5f, 0.5f, 20.5f, 20.5f)));
        var row = 3 * PxPerMm + PxPerMm / 2 + 10; // between two horizontal lines
        for (var mm = 0; mm <= 20; mm++)
        {
            var x = (int)Math.Round((0.5 + mm) * PxPerMm);
            var pixel = Darkest(bitmap, x, row);
            Assert.Equal(mm % 5 == 0 ? Ink.GridBold : Ink.GridFine, pixel);
        }

        // Nothing between the lines: the middle of every millimetre is paper.
        for (var mm = 0; mm < 20; mm++)
        {
            Assert.Equal(SKColors.White, bitmap.GetPixel((int)Math.Round((1.0 + mm) * PxPerMm), row));
        }
    }

    private static SKBitmap Raster(int widthMm, int heightMm, Action<SKCanvas, StripRenderer> draw)
    {
        var bitmap = new SKBitmap(widthMm * PxPerMm, heightMm * PxPerMm);
        using var canvas = new SKCanvas(bitmap);
        canvas.Clear(SKColors.White);
        canvas.Scale(PxPerMm);
        using var renderer = new StripRenderer();
        draw(canvas, renderer);
        canvas.Flush();
        return bitmap;
    }

    private static bool Dark(SKColor c) => c.Red < 128 && c.Green < 128 && c.Blue < 128;

    private static (int Left, int Top, int Right, int Bottom) DarkBounds(SKBitmap b)
    {
        int left = int.MaxValue, top = int.MaxValue, right = -1, bottom = -1;
        for (var y = 0; y < b.Height; y++)
        {
            for (var x = 0; x < b.Width; x++)
            {
                if (Dark(b.GetPixel(x, y)))
                {
                    (left, top, right, bottom) = (Math.Min(left, x), Math.Min(top, y), Math.Max(right, x), Math.Max(bottom, y));
                }
            }
        }

        Assert.True(right >= 0, "nothing was drawn");
        return (left, top, right, bottom);
    }

    // The darkest pixel within a pixel of x (a line of 0.1 mm is two pixels wide and may straddle).
    private static SKColor Darkest(SKBitmap b, int x, int y) =>
        Enumerable.Range(x - 1, 3).Select(i => b.GetPixel(i, y)).OrderBy(c => c.Red + c.Green + c.Blue).First();
}
