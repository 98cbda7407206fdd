using System.Diagnostics.CodeAnalysis;
using System.Globalization;
using LongRecord.Formats.IO;

namespace LongRecord.Formats.Csv;

/// <summary>
/// Reads a CSV recording: optional <c>#</c> comment lines, a header row, then one row per sample time with a time column
/// (seconds or ISO 8601 local date-time) and one column per lead (format in this folder's README). The whole file is
/// validated and a sparse row index built at open; block reads then parse only the rows asked for.
/// </summary>
public sealed class CsvRecordingReader : RecordingReader
{
    private readonly ReadOnlyRecordingFile _file;
    private readonly CsvLineCursor _cursor;
    private readonly CsvHeader _header;
    private readonly CsvIndex _index;
    private readonly double[] _scale;

    // Where the previous read stopped, so consecutive blocks continue without skipping rows again.
    private long _nextRow = -1;
    private long _nextRowOffset;

    private CsvRecordingReader(ReadOnlyRecordingFile file, CsvLineCursor cursor, CsvHeader header, CsvIndex index)
    {
        _file = file;
        _cursor = cursor;
        _header = header;
        _index = index;
        _scale = new double[header.Leads.Count];
        var channels = new ChannelInfo[header.Leads.Count];
        for (var k = 0; k < channels.Length; k++)
        {
            var lead = header.Leads[k];
            var millivolts = VoltageUnits.MillivoltsPer(lead.Unit);
            _scale[k] = double.IsNaN(millivolts) ? 1 : millivolts;
            channels[k] = new ChannelInfo
            {
                Label = lead.Label,
                PhysicalUnit = lead.Unit,
                SamplingRateHz = index.SamplingRateHz,
                SampleCount = index.RowCount,

                // Text has no digital scale: one "digital unit" is the last decimal place written in the column.
                Gain = Math.Pow(10, index.Decimals[k]),
                Baseline = 0,

                // And no saturation limit.
                DigitalMin = int.MinValue,
                DigitalMax = int.MaxValue,
            };
        }

        var start = StartOf(file.Path, header, index);
        Info = new RecordingInfo
        {
            FilePath = file.Path,
            Format = RecordingFormat.Csv,
            FormatDetail = string.Create(CultureInfo.InvariantCulture,
                $"CSV ({CsvHeaderLine.Describe(header.Separator)}-separated, time in {(index.IsoTime ? "ISO 8601 date-time" : "seconds")})"),
            Channels = channels,
            StartDate = start is DateTime d ? DateOnly.FromDateTime(d) : null,
            StartTime = start is DateTime t ? TimeOnly.FromDateTime(t) : null,
            DurationS = index.RowCount / index.SamplingRateHz,
            Comments = header.Comments,
        };
    }

    public override RecordingInfo Info { get; }

    /// <summary>Opens <paramref name="path"/> read-only, validates every row and infers the sampling rate.</summary>
    /// <exception cref="RecordingFormatException">The file is missing or breaks the format; the message names line and byte.</exception>
    public static CsvRecordingReader Open(string path)
    {
        var file = ReadOnlyRecordingFile.Open(path);
        try
        {
            var cursor = new CsvLineCursor(file);
            var header = CsvHeader.Read(path, cursor);
            var index = CsvIndex.Build(path, header, cursor);
            return new CsvRecordingReader(file, cursor, header, index);
        }
        catch
        {
            file.Dispose();
            throw;
        }
    }

    /// <summary>
    /// True when <paramref name="head"/> (the first bytes of the file) is text whose first line after comments and blank
    /// lines is a header with a time column and at least one lead column; failing that, when <paramref name="path"/> ends
    /// in <c>.csv</c> and the head holds no NUL byte (so the reader, not the detector, explains what is wrong).
    /// </summary>
    public static bool Sniff(ReadOnlySpan<byte> head, string path)
    {
        if (head.IndexOf((byte)0) >= 0)
        {
            return false;
        }

        var text = head.StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF]) ? head[3..] : head;
        while (text.Length > 0)
        {
            var end = text.IndexOf((byte)'\n');
            var complete = end >= 0;
            var line = complete ? text[..end] : text;
            text = complete ? text[(end + 1)..] : default;
            var s = System.Text.Encoding.UTF8.GetString(line).Trim();
            if (s.Length == 0 || s[0] == '#')
            {
                continue;
            }

            if (CsvHeaderLine.TryParse(s, out _, out _) is null)
            {
                return true;
            }

            break;
        }

        return path.EndsWith(".csv", StringComparison.OrdinalIgnoreCase);
    }

    protected override void ReadCore(int channel, long start, Span<float> destination)
    {
        MoveTo(start);
        var scale = _scale[channel];
        for (var i = 0; i < destination.Length; i++)
        {
            var line = NextRow(start + i);
            var fields = new CsvFieldReader(line, _header.Separator);
            if (!fields.Skip(channel + 1))
            {
                Changed(start + i);
            }

            destination[i] = (float)(Parse(fields.Next(out _), start + i) * scale);
        }

        _nextRow = start + destination.Length;
        _nextRowOffset = _cursor.NextOffset;
    }

    protected override void ReadCore(ReadOnlySpan<int> channels, long start, int count, Span<float> destination)
    {
        MoveTo(start);
        // Parse only as far as the last column asked for.
        var leadCount = 0;
        foreach (var c in channels)
        {
            leadCount = Math.Max(leadCount, c + 1);
        }

        Span<float> row = leadCount <= 64 ? stackalloc float[leadCount] : new float[leadCount];
        for (var i = 0; i < count; i++)
        {
            var line = NextRow(start + i);
            var fields = new CsvFieldReader(line, _header.Separator);
            fields.Next(out _);
            for (var k = 0; k < leadCount; k++)
            {
                if (!fields.HasMore)
                {
                    Changed(start + i);
                }

                row[k] = (float)(Parse(fields.Next(out _), start + i) * _scale[k]);
            }

            for (var k = 0; k < channels.Length; k++)
            {
                destination[k * count + i] = row[channels[k]];
            }
        }

        _nextRow = start + count;
        _nextRowOffset = _cursor.NextOffset;
    }

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            _file.Dispose();
        }
    }

    private static DateTime? StartOf(string path, CsvHeader header, CsvIndex index)
    {
        if (index.FirstDateTime is DateTime first)
        {
            if (header.StartComment is DateTime stated && stated != first)
            {
                RecordingFormatException.Throw(path,
                    string.Create(CultureInfo.InvariantCulture, $"start comment at line {header.StartCommentLine} disagrees with the first row's time {first:yyyy-MM-ddTHH:mm:ss.FFFFFFF}"),
                    header.StartCommentOffset, "start comment");
            }

            return first;
        }

        // "# start:" names the clock time of time 0 in the seconds column.
        return header.StartComment?.AddTicks((long)Math.Round(index.FirstSeconds * TimeSpan.TicksPerSecond));
    }

    // Positions the cursor on data row `row`, from the nearest index entry or from where the last read stopped.
    private void MoveTo(long row)
    {
        var entry = (int)(row / CsvIndex.RowsPerEntry);
        var baseRow = (long)entry * CsvIndex.RowsPerEntry;
        var offset = _index.OffsetOfEntry(entry);
        if (_nextRow >= baseRow && _nextRow <= row)
        {
            baseRow = _nextRow;
            offset = _nextRowOffset;
        }

        _cursor.Seek(offset, 0);
        for (var r = baseRow; r < row; r++)
        {
            NextRow(r);
        }
    }

    private ReadOnlySpan<byte> NextRow(long row)
    {
        while (_cursor.TryReadLine(out var line))
        {
            if (!CsvFieldReader.IsBlankLine(line))
            {
                return line;
            }
        }

        Changed(row);
        return default;
    }

    private double Parse(ReadOnlySpan<byte> text, long row)
    {
        if (!CsvNumber.TryParse(text, out var value, out _))
        {
            Changed(row);
        }

        return value;
    }

    // Every row was checked at open, so a failure here means the file was modified since.
    [DoesNotReturn]
    private void Changed(long row) =>
        RecordingFormatException.Throw(_file.Path,
            string.Create(CultureInfo.InvariantCulture, $"data row {row + 1} no longer matches the file as opened (was it modified?)"),
            _cursor.LineOffset, "row");
}
