using System.Buffers;
using System.Buffers.Text;
using System.Globalization;
using System.Text;

namespace LongRecord.Formats.Csv;

/// <summary>
/// Writes a CSV recording in the format <see cref="CsvRecordingReader"/> reads: comma-separated, time column first.
/// Times are exact decimal fractions of the sample index (integer arithmetic, no accumulated drift); values use the
/// shortest text that reads back as the same float. The file is built under a temporary name and renamed on
/// <see cref="Complete"/>; disposing without completing leaves nothing.
/// </summary>
public sealed class CsvRecordingWriter : IDisposable
{
    private const int BufferBytes = 64 * 1024;

    private readonly string _path;
    private readonly string _tempPath;
    private readonly CsvWriterOptions _options;
    private readonly double[] _unitsPerMillivolt;
    private readonly int _timeDecimals;
    private readonly long _timeScale;
    private readonly long _integralRate;
    private readonly string _isoFormat;
    private readonly int _maxRowBytes;
    private readonly byte[] _buffer = new byte[BufferBytes];
    private int _used;
    private FileStream? _stream;
    private bool _completed;

    private CsvRecordingWriter(string path, CsvWriterOptions options)
    {
        _path = Path.GetFullPath(path);
        _options = options;
        _unitsPerMillivolt = options.Leads.Select(l => 1 / VoltageUnits.MillivoltsPer(l.Unit)).ToArray();
        var iso = options.TimeFormat == CsvTimeFormat.IsoDateTime;
        _timeDecimals = TimeDecimals(options.SamplingRateHz, iso);
        _timeScale = Pow10(_timeDecimals);
        _integralRate = options.SamplingRateHz == Math.Floor(options.SamplingRateHz) && options.SamplingRateHz < 1e9 ? (long)options.SamplingRateHz : 0;
        _isoFormat = "yyyy'-'MM'-'dd'T'HH':'mm':'ss" + (_timeDecimals > 0 ? "'.'" + new string('f', _timeDecimals) : "");

        // Time (≤ 40 bytes) plus, per lead, a separator and a float (≤ 15 bytes, e.g. -1.2345678E-05).
        _maxRowBytes = 48 + 20 * options.Leads.Count;
        _tempPath = Path.Combine(Path.GetDirectoryName(_path)!, $".{Path.GetFileName(_path)}.{Guid.NewGuid():N}.partial");
        _stream = new FileStream(_tempPath, FileMode.CreateNew, FileAccess.Write, FileShare.None, 1 << 16);
        _stream.Write(Encoding.UTF8.GetBytes(Preamble(options)));
    }

    /// <summary>Rows (samples per lead) written so far.</summary>
    public long RowCount { get; private set; }

    /// <summary>Starts a file that appears at <paramref name="path"/> (replacing any file there) on <see cref="Complete"/>.</summary>
    public static CsvRecordingWriter Create(string path, CsvWriterOptions options)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        Validate(options);
        return new CsvRecordingWriter(path, options);
    }

    /// <summary>
    /// Appends <paramref name="count"/> rows; samples in millivolts laid out lead after lead (lead k's at k × count), the
    /// layout of a multi-channel read. NaN is written as <c>NaN</c>.
    /// </summary>
    public void Write(ReadOnlySpan<float> samplesMv, int count)
    {
        var stream = _stream ?? throw new ObjectDisposedException(nameof(CsvRecordingWriter));
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        var leads = _unitsPerMillivolt.Length;
        if (samplesMv.Length < (long)count * leads)
        {
            throw new ArgumentException("samples are shorter than leads × count", nameof(samplesMv));
        }

        for (var i = 0; i < count; i++)
        {
            if (_used + _maxRowBytes > _buffer.Length)
            {
                stream.Write(_buffer, 0, _used);
                _used = 0;
            }

            var row = _buffer.AsSpan(_used);
            var n = WriteTime(row, RowCount);
            for (var k = 0; k < leads; k++)
            {
                row[n++] = (byte)',';
                var value = (float)(samplesMv[k * count + i] * _unitsPerMillivolt[k]);
                value.TryFormat(row[n..], out var written, default, CultureInfo.InvariantCulture);
                n += written;
            }

            row[n++] = (byte)'\n';
            _used += n;
            RowCount++;
        }
    }

    /// <summary>Flushes the rows and moves the file to its name.</summary>
    public void Complete()
    {
        var stream = _stream ?? throw new ObjectDisposedException(nameof(CsvRecordingWriter));
        stream.Write(_buffer, 0, _used);
        _used = 0;
        stream.Flush(flushToDisk: true);
        stream.Dispose();
        _stream = null;
        File.Move(_tempPath, _path, overwrite: true);
        _completed = true;
    }

    public void Dispose()
    {
        _stream?.Dispose();
        _stream = null;
        if (!_completed)
        {
            File.Delete(_tempPath);
        }
    }

    /// <summary>
    /// Decimal places of the time column: the fewest (at least 3) that write every sample time exactly when the rate
    /// divides a power of ten (250 Hz → 3, 128 Hz → 7), else enough that rounding stays below 0.1 % of the interval.
    /// </summary>
    internal static int TimeDecimals(double rateHz, bool iso)
    {
        var most = iso ? 7 : 9;
        if (rateHz == Math.Floor(rateHz) && rateHz < 1e9)
        {
            for (var d = 3; d <= most; d++)
            {
                if (Pow10(d) % (long)rateHz == 0)
                {
                    return d;
                }
            }
        }

        return Math.Min(most, Math.Max(6, (int)Math.Ceiling(Math.Log10(rateHz)) + 3));
    }

    private int WriteTime(Span<byte> row, long index)
    {
        // Units of 10^-d s since the first sample, rounded once: times never drift however long the recording.
        var units = _integralRate > 0
            ? checked(index * _timeScale + _integralRate / 2) / _integralRate
            : (long)Math.Round(index * (double)_timeScale / _options.SamplingRateHz);
        if (_options.TimeFormat == CsvTimeFormat.IsoDateTime)
        {
            var ticks = units * Pow10(7 - _timeDecimals);
            _options.Start!.Value.AddTicks(ticks).TryFormat(row, out var isoBytes, _isoFormat, CultureInfo.InvariantCulture);
            return isoBytes;
        }

        Utf8Formatter.TryFormat(units / _timeScale, row, out var n);
        row[n++] = (byte)'.';
        Utf8Formatter.TryFormat(units % _timeScale, row[n..], out var fraction, new StandardFormat('D', (byte)_timeDecimals));
        return n + fraction;
    }

    private static string Preamble(CsvWriterOptions options)
    {
        var text = new StringBuilder();
        foreach (var comment in options.Comments)
        {
            text.Append("# ").Append(comment).Append('\n');
        }

        if (options.TimeFormat == CsvTimeFormat.Seconds && options.Start is DateTime start)
        {
            text.Append("# start: ").Append(start.ToString("yyyy'-'MM'-'dd'T'HH':'mm':'ss", CultureInfo.InvariantCulture));
            var fraction = start.Ticks % TimeSpan.TicksPerSecond;
            if (fraction != 0)
            {
                text.Append('.').Append(fraction.ToString("D7", CultureInfo.InvariantCulture));
            }

            text.Append('\n');
        }

        text.Append(options.TimeFormat == CsvTimeFormat.IsoDateTime ? "time" : "time_s");
        foreach (var lead in options.Leads)
        {
            text.Append(',').Append(lead.Label).Append(" (").Append(lead.Unit).Append(')');
        }

        return text.Append('\n').ToString();
    }

    private static void Validate(CsvWriterOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        if (options.Leads is null || options.Leads.Count == 0)
        {
            throw new ArgumentException("at least one lead is required", nameof(options));
        }

        if (!(options.SamplingRateHz > 0) || double.IsInfinity(options.SamplingRateHz))
        {
            throw new ArgumentOutOfRangeException(nameof(options), options.SamplingRateHz, "sampling rate must be positive");
        }

        if (options.TimeFormat == CsvTimeFormat.IsoDateTime && options.Start is null)
        {
            throw new ArgumentException("ISO 8601 time needs a start date-time", nameof(options));
        }

        foreach (var lead in options.Leads)
        {
            if (string.IsNullOrWhiteSpace(lead.Label) || lead.Label.IndexOfAny([',', ';', '\t', '"', '\r', '\n']) >= 0 || lead.Label != lead.Label.Trim())
            {
                throw new ArgumentException($"lead label '{lead.Label}' is empty, padded, or holds a separator, quote or line break", nameof(options));
            }

            if (double.IsNaN(VoltageUnits.MillivoltsPer(lead.Unit)))
            {
                throw new ArgumentException($"unit '{lead.Unit}' of lead '{lead.Label}' is not a voltage unit", nameof(options));
            }
        }

        foreach (var comment in options.Comments)
        {
            if (comment.IndexOfAny(['\r', '\n']) >= 0 || comment.TrimStart().StartsWith("start:", StringComparison.OrdinalIgnoreCase))
            {
                throw new ArgumentException("a comment may not hold a line break or begin with 'start:'", nameof(options));
            }
        }
    }

    private static long Pow10(int d)
    {
        var p = 1L;
        for (var i = 0; i < d; i++)
        {
            p *= 10;
        }

        return p;
    }
}
