using LongRecord.Reporting.Drawing;
using SkiaSharp;

namespace LongRecord.Reporting.Pages;

/// <summary>The running header (service, recording, patient or pseudonym) and footer (caution, page n of N) of every page.</summary>
public static class PageFrame
{
    public static void Draw(ReportContext c, string section, int pageNumber, int pageCount)
    {
        var p = c.P;
        var left = ReportContext.MarginMm;
        var right = c.PageWidthMm - ReportContext.MarginMm;
        var header = c.Template.Header;
        var y = 11f;
        if (header.Count > 0)
        {
            p.Text(p.Fit(header[0], c.BodyWidthMm * 0.55f, 9, bold: true), left, y, 9, Ink.Accent, bold: true);
        }

        if (header.Count > 1)
        {
            p.Text(p.Fit(string.Join(" · ", header.Skip(1)), c.BodyWidthMm * 0.55f, 7.5f), left, y + 3.8f, 7.5f, Ink.Muted);
        }

        var m = c.Model;
        var who = m.Patient.Deidentified ? $"pseudonym {m.Patient.Pseudonym}" : m.Patient.Name ?? "patient not named";
        p.Text(p.Fit($"{m.Recording.Name} · {who}", c.BodyWidthMm * 0.42f, 8, bold: true), right, y, 8, Ink.Text, bold: true, align: SKTextAlign.Right);
        p.Text(section, right, y + 3.8f, 7.5f, Ink.Muted, align: SKTextAlign.Right);
        p.Line(left, 17, right, 17, Ink.Rule, 0.3f);

        var footer = (float)c.Template.Paper.HeightMm - 8;
        p.Line(left, footer - 3.5f, right, footer - 3.5f, Ink.Rule, 0.2f);
        p.Text($"LongRecord {m.ToolVersion} · automated findings, to be confirmed by qualified staff · times {(m.Recording.Start is null ? "elapsed from the first sample" : "as recorded")}", left, footer, 7, Ink.Muted);
        p.Text($"page {pageNumber} of {pageCount}", right, footer, 7, Ink.Muted, align: SKTextAlign.Right);
    }
}
