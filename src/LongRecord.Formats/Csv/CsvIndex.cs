using System.Diagnostics.CodeAnalysis;
using System.Globalization;
using System.Text;

namespace LongRecord.Formats.Csv;

/// <summary>
/// The one pass over a CSV recording made at open: validates every row (field count, numbers, time order, jitter),
/// infers the sampling rate, and keeps the byte offset of every <see cref="RowsPerEntry"/>-th data row so that any
/// sample can be reached by skipping fewer than that many rows. Memory: 8 bytes per entry, so 8 × fs × 3 600 / 1 024
/// bytes per hour of recording (14 KB/h at 500 Hz).
/// </summary>
internal sealed class CsvIndex
{
    public const int RowsPerEntry = 1024;

    private readonly List<long> _offsets = [];

    private CsvIndex()
    {
    }

    public long RowCount { get; private set; }

    public double SamplingRateHz { get; private set; }

    /// <summary>True when the time column holds ISO 8601 date-times rather than seconds.</summary>
    public bool IsoTime { get; private set; }

    /// <summary>Time of the first row: seconds as written, or the date-time.</summary>
    public double FirstSeconds { get; private set; }

    public DateTime? FirstDateTime { get; private set; }

    /// <summary>Most decimal places written in each lead column.</summary>
    public int[] Decimals { get; private set; } = [];

    /// <summary>Byte offset of data row <paramref name="entry"/> × <see cref="RowsPerEntry"/>.</summary>
    public long OffsetOfEntry(int entry) => _offsets[entry];

    public static CsvIndex Build(string path, CsvHeader header, CsvLineCursor cursor)
    {
        var index = new CsvIndex();
        var leads = header.Leads;
        var decimals = new int[leads.Count];
        var rate = new CsvRateEstimator();
        long ticks0 = 0;
        double previous = 0;
        long lastLine = 0;
        long lastOffset = 0;
        cursor.Seek(header.DataOffset, header.DataLine);
        while (cursor.TryReadLine(out var line))
        {
            if (CsvFieldReader.IsBlankLine(line))
            {
                continue;
            }

            var lineOffset = cursor.LineOffset;
            if (index.RowCount % RowsPerEntry == 0)
            {
                index._offsets.Add(lineOffset);
            }

            var fields = new CsvFieldReader(line, header.Separator);
            var timeText = fields.Next(out var timeStart);
            double time;
            int timeDecimals;
            if (index.RowCount == 0)
            {
                index.IsoTime = FirstTime(path, timeText, cursor.LineNumber, lineOffset + timeStart, out time, out timeDecimals, out var first);
                index.FirstDateTime = index.IsoTime ? first : null;
                index.FirstSeconds = index.IsoTime ? 0 : time;
                ticks0 = first.Ticks;
            }
            else if (index.IsoTime)
            {
                if (!CsvIsoTime.TryParse(timeText, out var t, out timeDecimals))
                {
                    Fail(path, $"time '{Show(timeText)}' at line {cursor.LineNumber} is not an ISO 8601 date-time like the first row's", lineOffset + timeStart, "time");
                }

                time = (t.Ticks - ticks0) / (double)TimeSpan.TicksPerSecond;
            }
            else if (!CsvNumber.TryParse(timeText, out time, out timeDecimals) || double.IsNaN(time))
            {
                Fail(path, $"time '{Show(timeText)}' at line {cursor.LineNumber} is not a number of seconds like the first row's", lineOffset + timeStart, "time");
            }

            if (index.RowCount > 0 && !(time > previous))
            {
                Fail(path, $"time '{Show(timeText)}' at line {cursor.LineNumber} is not later than the previous row's: time must increase", lineOffset + timeStart, "time");
            }

            rate.Add(time, timeDecimals, cursor.LineNumber, lineOffset);
            previous = time;

            for (var k = 0; k < leads.Count; k++)
            {
                if (!fields.HasMore)
                {
                    Fail(path, $"line {cursor.LineNumber} has {k + 1} fields, the header has {leads.Count + 1}", lineOffset, "row");
                }

                var text = fields.Next(out var start);
                if (!CsvNumber.TryParse(text, out _, out var d))
                {
                    var hint = header.Separator == ';' && text.IndexOf((byte)',') >= 0 ? " (decimal comma: numbers use a decimal point)" : "";
                    Fail(path, $"value '{Show(text)}' in column '{leads[k].HeaderText}' at line {cursor.LineNumber} is not a number{hint}", lineOffset + start, leads[k].HeaderText);
                }

                decimals[k] = Math.Max(decimals[k], d);
            }

            if (fields.HasMore)
            {
                var extra = 1;
                while (fields.HasMore)
                {
                    fields.Next(out _);
                    extra++;
                }

                Fail(path, $"line {cursor.LineNumber} has {leads.Count + extra} fields, the header has {leads.Count + 1}", lineOffset, "row");
            }

            index.RowCount++;
            lastLine = cursor.LineNumber;
            lastOffset = lineOffset;
        }

        if (index.RowCount == 0)
        {
            Fail(path, $"no data rows after the header", cursor.NextOffset, "row");
        }

        if (index.RowCount == 1)
        {
            Fail(path, $"only one data row (line {lastLine}): two or more are needed to infer the sampling rate", lastOffset, "row");
        }

        index.SamplingRateHz = rate.Finish(path);
        index.Decimals = decimals;
        return index;
    }

    // The first row decides the time format for the whole file.
    private static bool FirstTime(string path, ReadOnlySpan<byte> text, long line, long offset, out double time, out int decimals, out DateTime first)
    {
        first = default;
        if (CsvNumber.TryParse(text, out time, out decimals) && !double.IsNaN(time))
        {
            return false;
        }

        if (CsvIsoTime.TryParse(text, out first, out decimals))
        {
            time = 0;
            return true;
        }

        Fail(path, $"unknown time format '{Show(text)}' at line {line}: expected seconds (0.004) or an ISO 8601 local date-time (2026-03-04T08:15:00.004)", offset, "time");
        return false;
    }

    [DoesNotReturn]
    private static void Fail(string path, FormattableString problem, long offset, string field) =>
        RecordingFormatException.Throw(path, problem.ToString(CultureInfo.InvariantCulture), offset, field);

    private static string Show(ReadOnlySpan<byte> text) => CsvHeaderLine.Shorten(Encoding.UTF8.GetString(text));
}
