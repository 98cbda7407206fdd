using LongRecord.Reporting.Drawing;
using LongRecord.Reporting.Model;
using SkiaSharp;
using static LongRecord.Reporting.Pages.ReportText;

namespace LongRecord.Reporting.Pages;

/// <summary>
/// Every episode in rank order, one row each with the evidence for its class on a line beneath; as many pages as
/// needed (the template may cap the rows; a closing line counts the rest).
/// </summary>
public sealed class EpisodeTablePage : IReportSection
{
    private const float HeadMm = 12;
    private const float RowMm = 10.6f;
    private const float EvidencePt = 7;
    private const float Pt = 8;

    private static readonly (string Title, float Width)[] s_columns =
    [
        ("rank", 10), ("kind", 34), ("start", 21), ("duration", 15), ("beats", 11), ("rate, bpm", 19),
        ("QRS", 23), ("rhythm", 16), ("onset / end seen", 22), ("review", 15),
    ];

    public string Title => "Episodes";

    public int PageCount(ReportContext c) => Math.Max(1, (int)Math.Ceiling((Shown(c) + 1) / (double)RowsPerPage(c)));

    public void DrawPage(ReportContext c, int page)
    {
        var p = c.P;
        var left = ReportContext.MarginMm;
        var y = ReportContext.BodyTopMm + 5;
        var episodes = c.Model.Episodes;
        p.Text(page == 0 ? "Episodes, most important first" : "Episodes, continued", left, y, 11, Ink.Text, bold: true);
        // Counts over every episode (as summary.json has them); a group of similar episodes is one row.
        var total = c.Model.EpisodeCounts.Sum(kv => kv.Value);
        var flagged = c.Model.FlaggedEpisodeCount ?? episodes.Count(e => e.Flagged);
        var rows = total > episodes.Count ? $" in {Count(episodes.Count)} rows" : "";
        p.Text($"{Count(total)} episodes{rows}, {Count(flagged)} flagged for review, {Count(episodes.Count(e => e.Urgent))} urgent", left + c.BodyWidthMm, y, 8, Ink.Muted, align: SKTextAlign.Right);
        y += 6;
        var x = left;
        foreach (var (title, width) in s_columns)
        {
            p.Text(title, x, y, 7, Ink.Muted);
            x += width;
        }

        p.Line(left, y + 1.5f, left + c.BodyWidthMm, y + 1.5f, Ink.Rule);
        y += 1.5f;
        var perPage = RowsPerPage(c);
        var shown = Shown(c);
        var first = page * perPage;
        for (var i = first; i < Math.Min(shown, first + perPage); i++)
        {
            Row(c, episodes[i], y);
            y += RowMm;
        }

        if (episodes.Count == 0 && page == 0)
        {
            p.Text("No episodes were found.", left, y + 5, Pt, Ink.Muted);
        }
        else if (shown < episodes.Count && first + perPage > shown)
        {
            p.Text($"… {Count(episodes.Count - shown)} more episodes (lower ranks) are listed in episodes.csv; this template shows the first {Count(shown)}.", left, y + 5, Pt, Ink.Muted);
        }
    }

    private static int Shown(ReportContext c) => Math.Min(c.Model.Episodes.Count, c.Template.EpisodeRows);

    private static int RowsPerPage(ReportContext c) => (int)((c.BodyBottomMm - ReportContext.BodyTopMm - HeadMm - 8) / RowMm);

    private static void Row(ReportContext c, ReportEpisode e, float top)
    {
        var p = c.P;
        var y = top + 4;
        var cells = new[]
        {
            Count(e.Rank),
            Kind(e.Kind),
            c.Moment(e.StartS),
            Duration(e.DurationS),
            Count(e.Beats),
            double.IsFinite(e.MaxBpm) ? $"{Number(e.RateBpm, 0)} / {Number(e.MaxBpm, 0)}" : Number(e.RateBpm, 0),
            double.IsFinite(e.QrsMs) ? $"{Number(e.QrsMs, 0)} ms {e.QrsClass}" : e.QrsClass.Length > 0 ? e.QrsClass : None,
            e.Regularity.Length > 0 ? e.Regularity : None,
            $"{(e.OnsetObserved ? "yes" : "no")} / {(e.OffsetObserved ? "yes" : "no")}",
            e.Urgent ? "URGENT" : e.Flagged ? "flagged" : "",
        };
        if (e.Urgent || e.Flagged)
        {
            p.Box(new SKRect(ReportContext.MarginMm, top + 0.4f, ReportContext.MarginMm + 1, top + RowMm - 0.4f), e.Urgent ? Ink.Flag : Ink.Accent);
        }

        var x = ReportContext.MarginMm + 2;
        for (var i = 0; i < cells.Length; i++)
        {
            var color = i == cells.Length - 1 && e.Urgent ? Ink.Flag : Ink.Text;
            // A long kind name is set a little smaller rather than cut.
            var size = i == 1 && p.Measure(cells[i], Pt, bold: true) > s_columns[i].Width - 1.5f ? Pt - 1.2f : Pt;
            p.Text(p.Fit(cells[i], s_columns[i].Width - 1.5f, size, bold: i == 1), x, y, size, color, bold: i == 1 || (i == cells.Length - 1 && e.Urgent));
            x += s_columns[i].Width - (i == 0 ? 2 : 0);
        }

        var (line1, line2) = TwoLines(p, e.Evidence, c.BodyWidthMm - 14, EvidencePt);
        p.Text(line1, ReportContext.MarginMm + 10, y + 3.3f, EvidencePt, Ink.Muted);
        p.Text(line2, ReportContext.MarginMm + 10, y + 6.1f, EvidencePt, Ink.Muted);
        p.Line(ReportContext.MarginMm, top + RowMm, ReportContext.MarginMm + c.BodyWidthMm, top + RowMm, Ink.Panel, 0.2f);
    }

    // The evidence on two lines: whole words on the first, the rest on the second (shortened only if it overflows).
    private static (string, string) TwoLines(Painter p, string text, float widthMm, float sizePt)
    {
        if (p.Measure(text, sizePt, false) <= widthMm)
        {
            return (text, "");
        }

        var words = text.Split(' ');
        var n = 1;
        while (n < words.Length && p.Measure(string.Join(' ', words[..(n + 1)]), sizePt, false) <= widthMm)
        {
            n++;
        }

        return (string.Join(' ', words[..n]), p.Fit(string.Join(' ', words[n..]), widthMm, sizePt));
    }
}
