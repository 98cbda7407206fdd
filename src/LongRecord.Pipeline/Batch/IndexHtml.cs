using System.Globalization;
using System.Net;
using System.Text;

namespace LongRecord.Pipeline.Batch;

/// <summary>
/// <c>index.html</c>: one self-contained page (no script, no external files) listing the batch's recordings with a
/// link to each report. A plain table of our own design: failed lines first-column-marked and their reason in full.
/// </summary>
public static class IndexHtml
{
    private const string Style = """
        body { font-family: sans-serif; margin: 1.5em; color: #222; }
        h1 { font-size: 1.3em; margin-bottom: 0.2em; }
        p.note { font-size: 0.9em; color: #555; max-width: 60em; }
        table { border-collapse: collapse; font-size: 0.9em; }
        th, td { padding: 0.25em 0.6em; border-bottom: 1px solid #ccc; text-align: left; vertical-align: top; }
        th { border-bottom: 2px solid #888; }
        td.n { text-align: right; font-variant-numeric: tabular-nums; }
        tr.failed td:first-child { border-left: 4px solid #b00; }
        tr.failed td.reason { color: #900; }
        """;

    public static string Render(IReadOnlyList<BatchIndexRow> rows, ShardSpec shard)
    {
        // Columns only for the kinds some recording of this batch has (index.csv keeps every kind).
        var kinds = IndexFigures.EpisodeKinds.Append(IndexFigures.OtherKind)
            .Where(k => rows.Any(r => r.Figures.EpisodesByKind.GetValueOrDefault(k) > 0)).ToArray();
        var html = new StringBuilder();
        html.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n<title>LongRecord batch index</title>\n<style>\n")
            .Append(Style).Append("</style>\n</head>\n<body>\n");
        html.Append("<h1>LongRecord batch index").Append(shard.IsWhole ? "" : $" — shard {shard}").Append("</h1>\n");
        html.Append(CultureInfo.InvariantCulture,
            $"<p>{rows.Count} recording(s): {rows.Count(r => r.Status == BatchStatus.Done)} analysed in this run, {rows.Count(r => r.Status == BatchStatus.Unchanged)} unchanged since an earlier run, {rows.Count(r => r.Status == BatchStatus.Failed)} failed. Written {DateTime.UtcNow:yyyy-MM-dd HH:mm} UTC.</p>\n");
        html.Append("<p class=\"note\">Automated findings for review: every finding must be confirmed by a qualified physiologist or physician before it informs care. Episode counts are the episodes listed for review in each recording's episodes.csv.</p>\n");
        html.Append("<table>\n<thead><tr><th>recording</th><th>status</th><th>duration (h)</th><th>analysable (%)</th><th>AF burden (%)</th>");
        foreach (var k in kinds)
        {
            html.Append("<th>").Append(Encode(k)).Append("</th>");
        }

        html.Append("<th>report</th></tr></thead>\n<tbody>\n");
        foreach (var r in rows)
        {
            var failed = r.Status == BatchStatus.Failed;
            html.Append(failed ? "<tr class=\"failed\">" : "<tr>").Append("<td>").Append(Encode(r.Recording)).Append("</td>");
            if (failed)
            {
                html.Append("<td>failed</td><td class=\"reason\" colspan=\"").Append(3 + kinds.Length + 1).Append("\">").Append(Encode(r.Reason)).Append("</td></tr>\n");
                continue;
            }

            html.Append("<td>").Append(r.StatusWord).Append("</td>")
                .Append("<td class=\"n\">").Append(IndexFigures.Format(r.Figures.DurationS / 3600, "0.00")).Append("</td>")
                .Append("<td class=\"n\">").Append(IndexFigures.Format(r.Figures.AnalysablePercent, "0.0")).Append("</td>")
                .Append("<td class=\"n\">").Append(IndexFigures.Format(r.Figures.AfBurdenPercent, "0.00")).Append("</td>");
            foreach (var k in kinds)
            {
                html.Append("<td class=\"n\">").Append(r.Figures.EpisodesByKind.GetValueOrDefault(k).ToString(CultureInfo.InvariantCulture)).Append("</td>");
            }

            var label = r.Link!.EndsWith(BatchIndex.ReportFileName, StringComparison.Ordinal) ? "report (PDF)" : "folder (no PDF)";
            html.Append("<td><a href=\"").Append(Encode(Href(r.Link))).Append("\">").Append(label).Append("</a></td></tr>\n");
        }

        return html.Append("</tbody>\n</table>\n</body>\n</html>\n").ToString();
    }

    private static string Encode(string text) => WebUtility.HtmlEncode(text);

    // Each path segment escaped, so a name with spaces or '#' still links.
    private static string Href(string link) => string.Join('/', link.Split('/').Select(Uri.EscapeDataString));
}
