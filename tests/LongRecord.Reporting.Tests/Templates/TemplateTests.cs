using LongRecord.Reporting.Templates;
using LongRecord.Reporting.Tests.Support;
using LongRecord.TestSupport;

namespace LongRecord.Reporting.Tests.Templates;

/// <summary>The template schema of report-templates/README.md, and what a template changes (pages, never figures).</summary>
public sealed class TemplateTests
{
    [Fact]
    public void BuiltIns_StandardAndBrief_LoadWithTheirDocumentedContent()
    {
        Assert.Contains("standard", TemplateLoader.BuiltInNames);
        Assert.Contains("brief", TemplateLoader.BuiltInNames);
        var standard = TemplateLoader.Load("standard");
        var brief = TemplateLoader.Load("brief");
        Assert.Equal(ReportTemplate.KnownSections, standard.Sections);
        Assert.True(brief.FullStrips < standard.FullStrips);
        Assert.False(brief.ReferenceStrips);
    }

    [Fact]
    public void BadTemplate_ListsEveryProblemAtOnce()
    {
        var e = Assert.Throws<ReportTemplateException>(() => TemplateLoader.Parse(
            """{ "name": "x", "paper": "A5", "sections": ["overview", "graphs"], "fullStrips": -1, "colour": "blue" }""", "t.json"));
        Assert.Equal(4, e.Problems.Count);
        Assert.Contains(e.Problems, p => p.Contains("\"colour\""));
        Assert.Contains(e.Problems, p => p.Contains("A5"));
        Assert.Contains(e.Problems, p => p.Contains("\"graphs\""));
        Assert.Contains(e.Problems, p => p.Contains("fullStrips"));
        Assert.StartsWith("t.json: ", e.Message);
    }

    [Fact]
    public void Letter_GivesUsLetterPages()
    {
        using var folder = new TempFolder("template");
        var template = TemplateLoader.Parse("""{ "name": "letter", "paper": "Letter", "sections": ["overview", "strips"] }""", "letter");
        var pdf = folder.Path("r.pdf");
        PdfReport.Write(pdf, HandBuiltReport.Model(), template, new SyntheticStrips());
        // US Letter is 8.5 × 11 in = 612 × 792 pt.
        Assert.Matches(@"Page size:\s+612 x 792 pts \(letter\)", Poppler.Run("pdfinfo", pdf));
    }

    [Fact]
    public void Brief_DrawsFewerStrips_ButTheSameFigures()
    {
        using var folder = new TempFolder("template");
        var model = HandBuiltReport.Model();
        PdfReport.Write(folder.Path("standard.pdf"), model, TemplateLoader.Load("standard"), new SyntheticStrips());
        PdfReport.Write(folder.Path("brief.pdf"), model, TemplateLoader.Load("brief"), new SyntheticStrips());
        var standard = Poppler.Text(folder.Path("standard.pdf"), 1, Poppler.Pages(folder.Path("standard.pdf")));
        var brief = Poppler.Text(folder.Path("brief.pdf"), 1, Poppler.Pages(folder.Path("brief.pdf")));
        Assert.Contains("Slowest rate", standard);
        Assert.DoesNotContain("Slowest rate", brief);
        // The overview is the same page in both: a template never changes a figure.
        Assert.Equal(Poppler.Text(folder.Path("standard.pdf")).Split('\n')[2..^3], Poppler.Text(folder.Path("brief.pdf")).Split('\n')[2..^3]);
    }

    [Fact]
    public void StripCap_LimitsThumbnailsDrawn_NeverTheEpisodesListed()
    {
        using var folder = new TempFolder("template");
        var template = TemplateLoader.Parse("""{ "name": "one", "sections": ["episodes", "thumbnails"], "thumbnailStrips": 1 }""", "one");
        var pdf = folder.Path("r.pdf");
        PdfReport.Write(pdf, HandBuiltReport.Model(), template, new SyntheticStrips());
        var text = Poppler.Text(pdf, 1, Poppler.Pages(pdf));
        // The hand-built model has five episodes, three of them flagged.
        Assert.Contains("5 episodes, 3 flagged for review", text);
        Assert.Contains("draws the first 1 of 3", text);
    }

    [Fact]
    public void CommandLine_TemplateByPath_IsUsed_AndABadOneIsOneLineUserError()
    {
        using var folder = new TempFolder("template");
        var edf = folder.Path("rec.edf");
        CommandLine.Check("synth", "sinus-rest", "--out", edf, "--hours", "0.02");
        var only = folder.Write("overview-only.json", """{ "name": "overview-only", "sections": ["overview"] }"""u8.ToArray());
        CommandLine.Check("summarise", edf, "--out", folder.Path("out"), "--template", only);
        Assert.Equal(1, Poppler.Pages(folder.Path("out/rec/report.pdf")));

        var bad = folder.Write("bad.json", """{ "name": "bad", "sections": [] }"""u8.ToArray());
        var (code, _, stderr) = CommandLine.Run("summarise", edf, "--out", folder.Path("out2"), "--template", bad);
        Assert.Equal(2, code);
        var line = Assert.Single(stderr.Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.StartsWith(bad + ": ", line);
        Assert.False(Directory.Exists(folder.Path("out2")));
    }
}
