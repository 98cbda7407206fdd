using System.Globalization;
using System.Text;

namespace LongRecord.Formats.Csv;

/// <summary>The comment lines and header row at the top of a CSV recording.</summary>
internal sealed record CsvHeader
{
    public required char Separator { get; init; }

    public required string TimeColumn { get; init; }

    public required IReadOnlyList<CsvColumn> Leads { get; init; }

    /// <summary>Comment lines (text after <c>#</c>), the <c>start:</c> line excluded.</summary>
    public required IReadOnlyList<string> Comments { get; init; }

    /// <summary>Date-time of time 0 given by a <c># start:</c> line, or null.</summary>
    public required DateTime? StartComment { get; init; }

    /// <summary>Line number of the <c># start:</c> line (0 when there is none).</summary>
    public required long StartCommentLine { get; init; }

    /// <summary>Byte offset of the <c># start:</c> line (0 when there is none).</summary>
    public required long StartCommentOffset { get; init; }

    public required long DataOffset { get; init; }

    /// <summary>Number of the first line after the header.</summary>
    public required long DataLine { get; init; }

    private static ReadOnlySpan<byte> Bom => [0xEF, 0xBB, 0xBF];

    public static CsvHeader Read(string path, CsvLineCursor cursor)
    {
        var comments = new List<string>();
        DateTime? start = null;
        long startLine = 0;
        long startOffset = 0;
        cursor.Seek(0, 1);
        while (cursor.TryReadLine(out var raw))
        {
            var lineOffset = cursor.LineOffset;
            var line = Decode(cursor.LineNumber == 1 && raw.StartsWith(Bom) ? raw[Bom.Length..] : raw).Trim();
            if (line.Length == 0)
            {
                continue;
            }

            if (line[0] == '#')
            {
                var text = line[1..].Trim();
                if (text.StartsWith("start:", StringComparison.OrdinalIgnoreCase))
                {
                    var value = text["start:".Length..].Trim();
                    if (!CsvIsoTime.TryParse(Encoding.UTF8.GetBytes(value), out var s, out _))
                    {
                        RecordingFormatException.Throw(path,
                            string.Create(CultureInfo.InvariantCulture, $"start comment '{CsvHeaderLine.Shorten(value)}' at line {cursor.LineNumber} is not an ISO 8601 date-time such as 2026-03-04T08:15:00"),
                            lineOffset, "start comment");
                    }

                    start = s;
                    startLine = cursor.LineNumber;
                    startOffset = lineOffset;
                }
                else
                {
                    comments.Add(text);
                }

                continue;
            }

            var problem = CsvHeaderLine.TryParse(line, out var separator, out var cells);
            if (problem is not null)
            {
                RecordingFormatException.Throw(path, string.Create(CultureInfo.InvariantCulture, $"{problem} (line {cursor.LineNumber})"), lineOffset, "header");
            }

            var leads = new CsvColumn[cells.Length - 1];
            for (var k = 0; k < leads.Length; k++)
            {
                var (label, unit) = CsvColumn.SplitUnit(cells[k + 1]);
                leads[k] = new CsvColumn(label, unit ?? CsvColumn.DefaultUnit, cells[k + 1]);
            }

            return new CsvHeader
            {
                Separator = separator,
                TimeColumn = cells[0],
                Leads = leads,
                Comments = comments,
                StartComment = start,
                StartCommentLine = startLine,
                StartCommentOffset = startOffset,
                DataOffset = cursor.NextOffset,
                DataLine = cursor.LineNumber + 1,
            };
        }

        RecordingFormatException.Throw(path, "no header row: the file holds only comments or blank lines", cursor.NextOffset, "header");
        return null;
    }

    private static string Decode(ReadOnlySpan<byte> line) => Encoding.UTF8.GetString(line);
}
