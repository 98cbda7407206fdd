using System.Text;

namespace LongRecord.Pipeline.Outputs;

/// <summary>Writes rows of already formatted (invariant-culture) cells as CSV; cells holding a comma or quote are quoted.</summary>
public static class CsvTable
{
    public static void Write(string path, IReadOnlyList<string> header, IEnumerable<string[]> rows)
    {
        using var w = new StreamWriter(path, append: false, new UTF8Encoding(false), 1 << 16);
        w.NewLine = "\n";
        w.WriteLine(string.Join(',', header.Select(Cell)));
        foreach (var row in rows)
        {
            w.WriteLine(string.Join(',', row.Select(Cell)));
        }
    }

    private static string Cell(string value) =>
        value.Contains(',') || value.Contains('"') || value.Contains('\n') ? $"\"{value.Replace("\"", "\"\"")}\"" : value;
}
