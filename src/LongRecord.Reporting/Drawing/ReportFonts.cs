using SkiaSharp;

namespace LongRecord.Reporting.Drawing;

/// <summary>
/// The report's typefaces, loaded from the assembly (DejaVu Sans, regular and bold). A typeface that failed to load
/// would draw nothing and throw nothing, so each is checked for glyphs and a failure stops the report.
/// </summary>
public sealed class ReportFonts : IDisposable
{
    private ReportFonts(SKTypeface regular, SKTypeface bold)
    {
        Regular = regular;
        Bold = bold;
    }

    public SKTypeface Regular { get; }

    public SKTypeface Bold { get; }

    public static ReportFonts Load() => new(LoadFace("DejaVuSans.ttf"), LoadFace("DejaVuSans-Bold.ttf"));

    public void Dispose()
    {
        Regular.Dispose();
        Bold.Dispose();
    }

    private static SKTypeface LoadFace(string file)
    {
        using var stream = typeof(ReportFonts).Assembly.GetManifestResourceStream($"fonts/{file}")
            ?? throw new InvalidOperationException($"font {file} is not embedded in {typeof(ReportFonts).Assembly.GetName().Name}");
        var face = SKTypeface.FromStream(stream)
            ?? throw new InvalidOperationException($"font {file} could not be read");
        if (face.GlyphCount == 0)
        {
            face.Dispose();
            throw new InvalidOperationException($"font {file} has no glyphs: text would not be drawn");
        }

        return face;
    }
}
