using LongRecord.Pipeline.Outputs;

namespace LongRecord.Pipeline.Batch;

/// <summary>One line of the batch index.</summary>
/// <param name="Link">Relative link to the recording's report (<c>NAME/report.pdf</c>), or to its folder when there is
/// no PDF; null for a failed recording.</param>
public sealed record BatchIndexRow(string Recording, string OutputName, BatchStatus Status, string Reason, IndexFigures Figures, string? Link)
{
    public string StatusWord => Status switch
    {
        BatchStatus.Done => "done",
        BatchStatus.Unchanged => "unchanged",
        _ => "failed",
    };
}

/// <summary>
/// <c>index.csv</c> and <c>index.html</c> in the output root: a line per recording of the run (status, duration,
/// analysable percentage, AF burden, flagged episodes by kind, link to its report), so the reviewer starts the morning
/// from one page. A shard writes <c>index-shard-I-of-N.*</c> instead, so shards sharing an output folder never write
/// over each other; a run without <c>--shard</c> afterwards skips every unchanged recording and writes the whole index.
/// Both files are written under a temporary name and renamed when complete.
/// </summary>
public static class BatchIndex
{
    public const string ReportFileName = "report.pdf";

    public static IReadOnlyList<string> CsvColumns { get; } =
    [
        "recording", "output", "status", "reason", "duration_h", "analysable_percent", "af_burden_percent",
        .. IndexFigures.EpisodeKinds.Append(IndexFigures.OtherKind).Select(k => "episodes_" + k.Replace('-', '_')),
        "report",
    ];

    /// <summary>The index file names of a run: <c>index</c>, or <c>index-shard-I-of-N</c>.</summary>
    public static string BaseName(ShardSpec shard) => shard.IsWhole ? "index" : $"index-shard-{shard.Index}-of-{shard.Count}";

    public static IReadOnlyList<BatchIndexRow> Rows(string outputRoot, IEnumerable<BatchEntry> entries) => entries.Select(e =>
    {
        if (e.Status == BatchStatus.Failed)
        {
            return new BatchIndexRow(e.DisplayName, e.Input.OutputName, e.Status, e.Reason, IndexFigures.None, null);
        }

        var folder = Path.Combine(outputRoot, e.Input.OutputName);
        var link = File.Exists(Path.Combine(folder, ReportFileName)) ? $"{e.Input.OutputName}/{ReportFileName}" : $"{e.Input.OutputName}/";
        return new BatchIndexRow(e.DisplayName, e.Input.OutputName, e.Status, e.Status == BatchStatus.Done ? "" : e.Reason, IndexFigures.Read(folder), link);
    }).ToArray();

    /// <summary>Writes both index files; returns their paths.</summary>
    public static (string Csv, string Html) Write(string outputRoot, ShardSpec shard, IEnumerable<BatchEntry> entries)
    {
        var rows = Rows(outputRoot, entries);
        var name = BaseName(shard);
        var csv = Path.Combine(outputRoot, name + ".csv");
        var html = Path.Combine(outputRoot, name + ".html");
        WriteThenRename(csv, tmp => CsvTable.Write(tmp, CsvColumns, rows.Select(CsvCells)));
        WriteThenRename(html, tmp => File.WriteAllText(tmp, IndexHtml.Render(rows, shard)));
        return (csv, html);
    }

    public static string[] CsvCells(BatchIndexRow r) =>
    [
        r.Recording, r.OutputName, r.StatusWord, r.Reason,
        IndexFigures.Format(r.Figures.DurationS / 3600, "0.00"),
        IndexFigures.Format(r.Figures.AnalysablePercent, "0.0"),
        IndexFigures.Format(r.Figures.AfBurdenPercent, "0.00"),
        .. IndexFigures.EpisodeKinds.Append(IndexFigures.OtherKind).Select(k => r.Status == BatchStatus.Failed ? "" : r.Figures.EpisodesByKind.GetValueOrDefault(k).ToString(System.Globalization.CultureInfo.InvariantCulture)),
        r.Link ?? "",
    ];

    private static void WriteThenRename(string path, Action<string> write)
    {
        var tmp = $"{path}.tmp-{Guid.NewGuid():N}";
        try
        {
            write(tmp);
            File.Move(tmp, path, overwrite: true);
        }
        finally
        {
            if (File.Exists(tmp))
            {
                File.Delete(tmp);
            }
        }
    }
}
