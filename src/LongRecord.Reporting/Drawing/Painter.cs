using SkiaSharp;

namespace LongRecord.Reporting.Drawing;

/// <summary>Text and line drawing in millimetres on a page canvas, with the report's fonts.</summary>
public sealed class Painter : IDisposable
{
    private readonly SKPaint _fill = new() { IsAntialias = true, Style = SKPaintStyle.Fill };
    private readonly SKPaint _stroke = new() { IsAntialias = true, Style = SKPaintStyle.Stroke };
    // Text is laid out in points with linear (unhinted) metrics, so the PDF's glyph positions are the font's own
    // advances and text extracted from the PDF keeps its words whole.
    private readonly SKFont _font = new() { Subpixel = true, Edging = SKFontEdging.Antialias, LinearMetrics = true, Hinting = SKFontHinting.None };

    public Painter(ReportFonts fonts)
    {
        Fonts = fonts;
    }

    public ReportFonts Fonts { get; }

    public SKCanvas Canvas { get; set; } = null!;

    /// <summary>Draws <paramref name="text"/> with its baseline at <paramref name="y"/>; returns its width, mm.</summary>
    public float Text(string text, float x, float y, float sizePt, SKColor color, bool bold = false, SKTextAlign align = SKTextAlign.Left)
    {
        SetFont(sizePt, bold);
        _fill.Color = color;
        Canvas.Save();
        Canvas.Scale(1 / Mm.Points);
        Canvas.DrawText(text, x * Mm.Points, y * Mm.Points, align, _font, _fill);
        Canvas.Restore();
        return _font.MeasureText(text) / Mm.Points;
    }

    /// <summary>Width of <paramref name="text"/> at this size, mm.</summary>
    public float Measure(string text, float sizePt, bool bold = false)
    {
        SetFont(sizePt, bold);
        return _font.MeasureText(text) / Mm.Points;
    }

    /// <summary>Cuts <paramref name="text"/> with an ellipsis so it fits <paramref name="widthMm"/>.</summary>
    public string Fit(string text, float widthMm, float sizePt, bool bold = false)
    {
        if (Measure(text, sizePt, bold) <= widthMm)
        {
            return text;
        }

        var n = text.Length;
        while (n > 1 && Measure(text[..n] + "…", sizePt, bold) > widthMm)
        {
            n--;
        }

        return text[..n] + "…";
    }

    /// <summary>Splits <paramref name="text"/> into lines no wider than <paramref name="widthMm"/>.</summary>
    public List<string> Wrap(string text, float widthMm, float sizePt, bool bold = false)
    {
        var lines = new List<string>();
        var line = "";
        foreach (var word in text.Split(' '))
        {
            var next = line.Length == 0 ? word : line + " " + word;
            if (line.Length > 0 && Measure(next, sizePt, bold) > widthMm)
            {
                lines.Add(line);
                line = word;
            }
            else
            {
                line = next;
            }
        }

        if (line.Length > 0)
        {
            lines.Add(line);
        }

        return lines;
    }

    public void Line(float x0, float y0, float x1, float y1, SKColor color, float widthMm = 0.2f)
    {
        _stroke.Color = color;
        _stroke.StrokeWidth = widthMm;
        _stroke.PathEffect = null;
        Canvas.DrawLine(x0, y0, x1, y1, _stroke);
    }

    public void DashedLine(float x0, float y0, float x1, float y1, SKColor color, float widthMm = 0.25f)
    {
        using var dash = SKPathEffect.CreateDash([1.2f, 0.8f], 0);
        _stroke.Color = color;
        _stroke.StrokeWidth = widthMm;
        _stroke.PathEffect = dash;
        Canvas.DrawLine(x0, y0, x1, y1, _stroke);
        _stroke.PathEffect = null;
    }

    public void Box(SKRect r, SKColor fill)
    {
        _fill.Color = fill;
        Canvas.DrawRect(r, _fill);
    }

    public void Frame(SKRect r, SKColor color, float widthMm = 0.2f)
    {
        _stroke.Color = color;
        _stroke.StrokeWidth = widthMm;
        _stroke.PathEffect = null;
        Canvas.DrawRect(r, _stroke);
    }

    public void Path(SKPath path, SKColor color, float widthMm)
    {
        _stroke.Color = color;
        _stroke.StrokeWidth = widthMm;
        _stroke.PathEffect = null;
        _stroke.StrokeJoin = SKStrokeJoin.Round;
        Canvas.DrawPath(path, _stroke);
    }

    public void Dispose()
    {
        _fill.Dispose();
        _stroke.Dispose();
        _font.Dispose();
    }

    private void SetFont(float sizePt, bool bold)
    {
        _font.Typeface = bold ? Fonts.Bold : Fonts.Regular;
        _font.Size = sizePt;
    }
}
