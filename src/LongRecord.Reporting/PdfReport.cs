using LongRecord.Reporting.Drawing;
using LongRecord.Reporting.Model;
using LongRecord.Reporting.Pages;
using LongRecord.Reporting.Strips;
using LongRecord.Reporting.Templates;
using SkiaSharp;

namespace LongRecord.Reporting;

/// <summary>
/// Renders a <see cref="ReportModel"/> to a PDF (SkiaSharp's PDF backend, vector graphics, embedded DejaVu Sans):
/// the template's sections in its order. Written under a temporary name and renamed when complete.
/// </summary>
public static class PdfReport
{
    public static void Write(string path, ReportModel model, ReportTemplate template, IStripSource? strips)
    {
        var full = Path.GetFullPath(path);
        var temp = Path.Combine(Path.GetDirectoryName(full)!, $".{Path.GetFileName(full)}.partial-{Guid.NewGuid():N}");
        try
        {
            using (var stream = new FileStream(temp, FileMode.CreateNew, FileAccess.Write))
            {
                Render(stream, model, template, strips);
            }

            File.Move(temp, full, overwrite: true);
        }
        finally
        {
            if (File.Exists(temp))
            {
                File.Delete(temp);
            }
        }
    }

    /// <summary>Renders into <paramref name="output"/>; returns the number of pages.</summary>
    public static int Render(Stream output, ReportModel model, ReportTemplate template, IStripSource? strips)
    {
        using var fonts = ReportFonts.Load();
        using var painter = new Painter(fonts);
        using var renderer = new StripRenderer();
        var context = new ReportContext(model, template, strips, painter, renderer);
        var sections = template.Sections.Select(Section).ToArray();
        var counts = sections.Select(s => s.PageCount(context)).ToArray();
        var total = counts.Sum();
        var metadata = new SKDocumentPdfMetadata
        {
            Title = $"LongRecord report: {model.Recording.Name}",
            Creator = "LongRecord",
            Producer = $"LongRecord {model.ToolVersion}",
            RasterDpi = 300,
        };
        using var document = SKDocument.CreatePdf(output, metadata);
        var widthPt = (float)template.Paper.WidthMm * Mm.Points;
        var heightPt = (float)template.Paper.HeightMm * Mm.Points;
        var number = 0;
        for (var s = 0; s < sections.Length; s++)
        {
            for (var page = 0; page < counts[s]; page++)
            {
                var canvas = document.BeginPage(widthPt, heightPt);
                canvas.Scale(Mm.Points);
                painter.Canvas = canvas;
                PageFrame.Draw(context, sections[s].Title, ++number, total);
                sections[s].DrawPage(context, page);
                document.EndPage();
            }
        }

        document.Close();
        return total;
    }

    private static IReportSection Section(string name) => name switch
    {
        ReportTemplate.OverviewSection => new OverviewPage(),
        ReportTemplate.TrendsSection => new TrendsPage(),
        ReportTemplate.EpisodesSection => new EpisodeTablePage(),
        ReportTemplate.ThumbnailsSection => new ThumbnailPages(),
        ReportTemplate.StripsSection => new FullStripPages(),
        _ => throw new ArgumentException($"unknown report section {name}", nameof(name)),
    };
}
