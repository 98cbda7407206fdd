using LongRecord.Reporting.Templates;
using LongRecord.Reporting.Tests.Support;
using LongRecord.TestSupport;
using SkiaSharp;

namespace LongRecord.Reporting.Tests.Pdf;

/// <summary>
/// Layout regressions: the hand-built model's report rendered by pdftoppm at 40 dpi and compared page by page with
/// the reference images in Golden/ (made the same way, looked at and kept). Set LONGRECORD_UPDATE_GOLDEN=1 to write
/// new references after a deliberate layout change — and look at them before committing.
/// </summary>
public sealed class GoldenImageTests
{
    private const int Dpi = 40;

    // A pixel differs when any channel is off by more than 64 of 255 (anti-aliasing and font hinting move edges by
    // a shade); a page passes when at most 0.5 % of its pixels differ. Common practice, no source.
    private const int ChannelTolerance = 64;
    private const double PixelShareTolerance = 0.005;

    [Fact]
    public void HandBuiltReport_MatchesTheGoldenPages()
    {
        using var folder = new TempFolder("golden");
        var pdf = folder.Path("golden.pdf");
        PdfReport.Write(pdf, HandBuiltReport.Model(), TemplateLoader.Load("standard"), new SyntheticStrips());
        Poppler.Run("pdftoppm", "-r", $"{Dpi}", "-png", pdf, folder.Path("page"));
        var pages = Directory.GetFiles(folder.FullPath, "page-*.png").Order(StringComparer.Ordinal).ToArray();
        var golden = Path.Combine(AppContext.BaseDirectory, "Golden");
        if (Environment.GetEnvironmentVariable("LONGRECORD_UPDATE_GOLDEN") == "1")
        {
            var source = Path.GetFullPath(Path.Combine(AppContext.BaseDirectory, "../../../../../../tests/LongRecord.Reporting.Tests/Golden"));
            foreach (var p in pages)
            {
                File.Copy(p, Path.Combine(source, "standard" + Path.GetFileName(p)["page".Length..]), overwrite: true);
            }
        }

        var references = Directory.GetFiles(golden, "standard-*.png").Order(StringComparer.Ordinal).ToArray();
        Assert.Equal(references.Length, pages.Length);
        for (var i = 0; i < pages.Length; i++)
        {
            using var expected = SKBitmap.Decode(references[i]);
            using var actual = SKBitmap.Decode(pages[i]);
            Assert.Equal((expected.Width, expected.Height), (actual.Width, actual.Height));
            var differing = 0;
            for (var y = 0; y < expected.Height; y++)
            {
                for (var x = 0; x < expected.Width; x++)
                {
                    var a = expected.GetPixel(x, y);
                    var b = actual.GetPixel(x, y);
                    if (Math.Abs(a.Red - b.Red) > ChannelTolerance || Math.Abs(a.Green - b.Green) > ChannelTolerance || Math.Abs(a.Blue - b.Blue) > ChannelTolerance)
                    {
                        differing++;
                    }
                }
            }

            var share = differing / (double)(expected.Width * expected.Height);
            Assert.True(share <= PixelShareTolerance, $"page {i + 1}: {share:P2} of pixels differ from {Path.GetFileName(references[i])}");
        }
    }
}
