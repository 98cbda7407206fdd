namespace LongRecord.Formats.Wfdb;

/// <summary>
/// The record line (header(5), "Record line"): name, number of signals, sampling frequency with optional
/// <c>/counter frequency</c> and <c>(base counter)</c>, number of samples, base time, base date.
/// </summary>
internal sealed class WfdbRecordLine
{
    public required string Name { get; init; }
    public required int SignalCount { get; init; }
    public required int SignalCountOffset { get; init; }
    public double SamplingFrequencyHz { get; init; } = WfdbHeader.DefaultSamplingFrequencyHz;
    public double? CounterFrequencyHz { get; init; }
    public double BaseCounterValue { get; init; }
    public long? SamplesPerSignal { get; init; }
    public long SamplesPerSignalOffset { get; init; }
    public TimeOnly? BaseTime { get; init; }
    public DateOnly? BaseDate { get; init; }

    public static WfdbRecordLine Parse(WfdbHeaderLine line, string path)
    {
        var f = line.Fields();
        var name = f[0];
        if (name.Text.Contains('/'))
        {
            Fail(path, $"multi-segment records are not supported (record '{name.Text}')", name.Offset, "number of segments");
        }

        if (f.Count < 2)
        {
            Fail(path, "number of signals is missing", line.Offset + line.Text.Length, "number of signals");
        }

        if (!WfdbHeaderParser.TryParseInt(f[1].Text, out var signalCount) || signalCount < 0)
        {
            Fail(path, $"number of signals is not a non-negative integer ('{f[1].Text}')", f[1].Offset, "number of signals");
        }

        var fs = WfdbHeader.DefaultSamplingFrequencyHz;
        double? counter = null;
        double baseCounter = 0;
        if (f.Count > 2)
        {
            (fs, counter, baseCounter) = ParseFrequency(f[2], path);
        }

        long? samples = null;
        long samplesOffset = line.Offset + line.Text.Length;
        if (f.Count > 3)
        {
            samplesOffset = f[3].Offset;
            if (!WfdbHeaderParser.TryParseLong(f[3].Text, out var n) || n < 0)
            {
                Fail(path, $"number of samples per signal is not a non-negative integer ('{f[3].Text}')", f[3].Offset, "number of samples per signal");
            }

            samples = n == 0 ? null : n;
        }

        var time = f.Count > 4 ? ParseTime(f[4], path) : (TimeOnly?)null;
        var date = f.Count > 5 ? ParseDate(f[5], path) : null;
        if (f.Count > 6)
        {
            Fail(path, $"unexpected field '{f[6].Text}' after the base date", f[6].Offset, "base date");
        }

        return new WfdbRecordLine
        {
            Name = name.Text,
            SignalCount = signalCount,
            SignalCountOffset = f[1].Offset,
            SamplingFrequencyHz = fs,
            CounterFrequencyHz = counter,
            BaseCounterValue = baseCounter,
            SamplesPerSignal = samples,
            SamplesPerSignalOffset = samplesOffset,
            BaseTime = time,
            BaseDate = date,
        };
    }

    private static (double Fs, double? Counter, double BaseCounter) ParseFrequency(WfdbField field, string path)
    {
        var text = field.Text;
        var slash = text.IndexOf('/');
        var fsText = slash < 0 ? text : text[..slash];
        if (!WfdbHeaderParser.TryParseDouble(fsText, out var fs))
        {
            Fail(path, $"sampling frequency is not a number ('{fsText}')", field.Offset, "sampling frequency");
        }

        if (fs <= 0)
        {
            Fail(path, $"sampling frequency must be greater than zero ('{fsText}')", field.Offset, "sampling frequency");
        }

        if (slash < 0)
        {
            return (fs, null, 0);
        }

        var rest = text[(slash + 1)..];
        var open = rest.IndexOf('(');
        var counterText = open < 0 ? rest : rest[..open];
        var counterOffset = field.Offset + slash + 1;
        if (!WfdbHeaderParser.TryParseDouble(counterText, out var counter))
        {
            Fail(path, $"counter frequency is not a number ('{counterText}')", counterOffset, "counter frequency");
        }

        double baseCounter = 0;
        if (open >= 0)
        {
            var close = rest.IndexOf(')', open);
            var inner = close < 0 ? rest[(open + 1)..] : rest[(open + 1)..close];
            if (close != rest.Length - 1 || !WfdbHeaderParser.TryParseDouble(inner, out baseCounter))
            {
                Fail(path, $"base counter value is not a number in parentheses ('{rest[open..]}')", counterOffset + open, "base counter value");
            }
        }

        // header(5): a counter frequency that is not positive is taken as equal to the sampling frequency.
        return (fs, counter > 0 ? counter : fs, baseCounter);
    }

    private static TimeOnly ParseTime(WfdbField field, string path)
    {
        var parts = field.Text.Split(':');
        if (parts.Length == 3
            && WfdbHeaderParser.TryParseInt(parts[0], out var h) && h is >= 0 and < 24
            && WfdbHeaderParser.TryParseInt(parts[1], out var m) && m is >= 0 and < 60
            && WfdbHeaderParser.TryParseDouble(parts[2], out var s) && s is >= 0 and < 60
            && parts[2].Length > 0 && char.IsAsciiDigit(parts[2][0]))
        {
            var ticks = (long)Math.Round(s * TimeSpan.TicksPerSecond);
            return new TimeOnly(h, m).Add(TimeSpan.FromTicks(Math.Min(ticks, TimeSpan.TicksPerMinute - 1)));
        }

        Fail(path, $"base time is not HH:MM:SS ('{field.Text}')", field.Offset, "base time");
        return default;
    }

    private static DateOnly? ParseDate(WfdbField field, string path)
    {
        var parts = field.Text.Split('/');
        if (parts.Length == 3
            && WfdbHeaderParser.TryParseInt(parts[0], out var d) && WfdbHeaderParser.TryParseInt(parts[1], out var m) && WfdbHeaderParser.TryParseInt(parts[2], out var y))
        {
            // header(5) example 1 writes 0/0/0 for "date not recorded".
            if (d == 0 && m == 0 && y == 0)
            {
                return null;
            }

            if (y is >= 1 and <= 9999 && m is >= 1 and <= 12 && d >= 1 && d <= DateTime.DaysInMonth(y, m))
            {
                return new DateOnly(y, m, d);
            }
        }

        Fail(path, $"base date is not DD/MM/YYYY ('{field.Text}')", field.Offset, "base date");
        return null;
    }

    [System.Diagnostics.CodeAnalysis.DoesNotReturn]
    private static void Fail(string path, string problem, long offset, string field) =>
        RecordingFormatException.Throw(path, $"record line: {problem}", offset, field);
}
