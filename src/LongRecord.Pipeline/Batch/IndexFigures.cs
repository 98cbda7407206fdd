using System.Globalization;
using System.Text.Json;
using LongRecord.Analysis.Rhythm;

namespace LongRecord.Pipeline.Batch;

/// <summary>
/// The figures an index line shows for a finished recording, read back from its output folder, so that a recording
/// analysed now and one skipped as unchanged are shown from the same files: duration, analysable percentage and AF
/// burden from <c>summary.json</c>, counts of flagged episodes by kind from <c>episodes.csv</c>.
/// </summary>
public sealed record IndexFigures(double? DurationS, double? AnalysablePercent, double? AfBurdenPercent, IReadOnlyDictionary<string, int> EpisodesByKind)
{
    /// <summary>
    /// The kinds given a column of their own, in this order; any other kind counts under <c>other</c>. The one place to
    /// change when the episodes stage brings its kinds.
    /// </summary>
    public static readonly string[] EpisodeKinds = [.. LongRecord.Analysis.Episodes.EpisodeKinds.All];

    public const string OtherKind = "other";

    public static IndexFigures None { get; } = new(null, null, null, new Dictionary<string, int>());

    /// <summary>Reads <paramref name="outputFolder"/>; a figure whose file is missing or unreadable is left empty.</summary>
    public static IndexFigures Read(string outputFolder)
    {
        double? duration = null, analysable = null, burden = null;
        var summaryPath = Path.Combine(outputFolder, "summary.json");
        if (File.Exists(summaryPath))
        {
            try
            {
                using var doc = JsonDocument.Parse(File.ReadAllBytes(summaryPath));
                var root = doc.RootElement;
                analysable = Number(root, "analysable_percent");
                burden = Number(root, "af_burden_percent");
                duration = root.TryGetProperty("recording", out var recording) ? Number(recording, "duration_s") : null;
            }
            catch (JsonException)
            {
            }
        }

        return new IndexFigures(duration, analysable, burden, CountEpisodes(Path.Combine(outputFolder, "episodes.csv")));
    }

    private static double? Number(JsonElement e, string name) =>
        e.TryGetProperty(name, out var v) && v.ValueKind == JsonValueKind.Number ? v.GetDouble() : null;

    // Every row of episodes.csv is a finding flagged for review, unless the file has a "flagged" column that says not.
    private static Dictionary<string, int> CountEpisodes(string path)
    {
        var counts = new Dictionary<string, int>(StringComparer.Ordinal);
        if (!File.Exists(path))
        {
            return counts;
        }

        using var reader = new StreamReader(path);
        var header = reader.ReadLine() is string h ? SplitCsv(h) : [];
        var kind = Array.IndexOf(header, "kind");
        var flagged = Array.IndexOf(header, "flagged");
        if (kind < 0)
        {
            return counts;
        }

        while (reader.ReadLine() is string line)
        {
            var cells = SplitCsv(line);
            if (cells.Length <= kind || (flagged >= 0 && cells.Length > flagged && cells[flagged] is "0" or "false"))
            {
                continue;
            }

            var k = EpisodeKinds.Contains(cells[kind]) ? cells[kind] : OtherKind;
            counts[k] = counts.GetValueOrDefault(k) + 1;
        }

        return counts;
    }

    /// <summary>Splits one CSV line (RFC 4180 quoting: a quoted cell may hold commas and doubled quotes).</summary>
    public static string[] SplitCsv(string line)
    {
        var cells = new List<string>();
        var cell = new System.Text.StringBuilder();
        var quoted = false;
        for (var i = 0; i < line.Length; i++)
        {
            var c = line[i];
            if (quoted)
            {
                if (c == '"' && i + 1 < line.Length && line[i + 1] == '"')
                {
                    cell.Append('"');
                    i++;
                }
                else if (c == '"')
                {
                    quoted = false;
                }
                else
                {
                    cell.Append(c);
                }
            }
            else if (c == '"')
            {
                quoted = true;
            }
            else if (c == ',')
            {
                cells.Add(cell.ToString());
                cell.Clear();
            }
            else
            {
                cell.Append(c);
            }
        }

        cells.Add(cell.ToString());
        return cells.ToArray();
    }

    /// <summary>Invariant text of an optional figure, empty when absent.</summary>
    public static string Format(double? value, string format) => value is double v && double.IsFinite(v) ? v.ToString(format, CultureInfo.InvariantCulture) : "";
}
