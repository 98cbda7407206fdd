namespace LongRecord.Formats.Csv;

/// <summary>
/// Rules for the header row: separator, time column, lead columns. Shared by the reader (which reports the problem)
/// and <see cref="CsvRecordingReader.Sniff"/> (which only asks whether the line qualifies).
/// </summary>
internal static class CsvHeaderLine
{
    /// <summary>Accepted names of the time column, compared without case and without a unit suffix.</summary>
    public static readonly string[] TimeNames =
        ["time", "t", "time_s", "times", "seconds", "sec", "s", "elapsed", "elapsed_s", "timestamp", "datetime", "date_time"];

    private static readonly char[] s_separators = [',', ';', '\t'];

    /// <summary>Splits and checks <paramref name="line"/>; returns the problem, or null when it is a valid header.</summary>
    public static string? TryParse(string line, out char separator, out string[] cells)
    {
        separator = ',';
        cells = [];
        var present = Array.FindAll(s_separators, s => line.Contains(s));
        if (present.Length == 0)
        {
            return $"header '{Shorten(line)}' has one column; expected a time column and lead columns separated by ',', ';' or tab";
        }

        if (present.Length > 1)
        {
            return $"header '{Shorten(line)}' mixes separators {string.Join(" and ", present.Select(Describe))}; use one";
        }

        separator = present[0];
        cells = line.Split(separator);
        for (var i = 0; i < cells.Length; i++)
        {
            cells[i] = Unquote(cells[i].Trim());
            if (cells[i].Length == 0)
            {
                return FormattableString.Invariant($"header column {i + 1} has no name");
            }
        }

        var (timeName, timeUnit) = CsvColumn.SplitUnit(cells[0]);
        if (!IsTimeName(timeName))
        {
            return $"first header column '{Shorten(cells[0])}' is not a time column (expected one of {string.Join(", ", TimeNames)})";
        }

        if (timeUnit is not null and not "s")
        {
            return $"time column unit '{timeUnit}' is not supported: the time column holds seconds or ISO 8601 date-times";
        }

        return cells.Length < 2 ? "header has a time column but no lead column" : null;
    }

    public static bool IsTimeName(string name) => Array.Exists(TimeNames, n => string.Equals(n, name.Trim(), StringComparison.OrdinalIgnoreCase));

    public static string Describe(char separator) => separator switch
    {
        '\t' => "tab",
        _ => $"'{separator}'",
    };

    public static string Shorten(string text) => text.Length <= 40 ? text : text[..37] + "...";

    private static string Unquote(string cell) =>
        cell.Length >= 2 && cell[0] == '"' && cell[^1] == '"' ? cell[1..^1].Trim() : cell;
}
