using SkiaSharp;

namespace LongRecord.Reporting.Drawing;

/// <summary>The report's colours: our own restrained set; a meaning is always also given in words or position.</summary>
public static class Ink
{
    public static readonly SKColor Text = new(0x1C, 0x22, 0x2B);
    public static readonly SKColor Muted = new(0x5B, 0x66, 0x72);
    public static readonly SKColor Rule = new(0xB8, 0xC0, 0xC8);
    public static readonly SKColor Panel = new(0xF2, 0xF4, 0xF6);
    public static readonly SKColor Accent = new(0x24, 0x5A, 0x7A);
    public static readonly SKColor Rate = new(0x24, 0x5A, 0x7A);
    public static readonly SKColor RateBand = new(0xB9, 0xD2, 0xE1);
    public static readonly SKColor Af = new(0xA8, 0x55, 0x1E);
    public static readonly SKColor Analysable = new(0x4E, 0x7D, 0x4B);
    public static readonly SKColor Caution = new(0x8A, 0x5A, 0x00);
    public static readonly SKColor CautionPanel = new(0xFB, 0xF3, 0xE0);
    public static readonly SKColor Flag = new(0x9E, 0x2A, 0x2B);

    // Strip paper: the trade's millimetre grid, drawn light so the trace stays the darkest thing on the page.
    public static readonly SKColor GridFine = new(0xF2, 0xC4, 0xC0);
    public static readonly SKColor GridBold = new(0xDE, 0x8E, 0x88);
    public static readonly SKColor Trace = new(0x10, 0x10, 0x10);
}
