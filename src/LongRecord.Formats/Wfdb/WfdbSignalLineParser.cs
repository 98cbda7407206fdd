namespace LongRecord.Formats.Wfdb;

/// <summary>
/// Parses a signal specification line (header(5)): file name, format[xSPF][:skew][+offset],
/// gain[(baseline)][/units], ADC resolution, ADC zero, initial value, checksum, block size, description.
/// Each optional field may be present only when the one before it is.
/// </summary>
internal static class WfdbSignalLineParser
{
    public static WfdbSignalSpec Parse(WfdbHeaderLine line, string path)
    {
        var f = line.Fields(8);
        var where = $"header line {line.Number}";
        if (f.Count < 2)
        {
            Fail(path, where, "signal format is missing", line.Offset + line.Text.Length, "format");
        }

        var spec = ParseFormat(f[1], path, where) with
        {
            FileName = f[0].Text,
            LineNumber = line.Number,
            LineByteOffset = line.Offset,
        };

        if (f.Count > 2)
        {
            spec = ParseGain(f[2], path, where, spec);
        }

        if (f.Count > 3)
        {
            spec = spec with { AdcResolution = Int(f[3], path, where, "ADC resolution", min: 0) };
        }

        if (f.Count > 4)
        {
            spec = spec with { AdcZero = Int(f[4], path, where, "ADC zero") };
        }

        if (f.Count > 5)
        {
            spec = spec with { InitialValue = Int(f[5], path, where, "initial value") };
        }

        if (f.Count > 6)
        {
            spec = spec with { Checksum = Int(f[6], path, where, "checksum") };
        }

        if (f.Count > 7)
        {
            spec = spec with { BlockSize = Int(f[7], path, where, "block size") };
            var end = f[7].IndexInLine + f[7].Text.Length;
            var description = line.Text[end..].Trim(' ', '\t');
            if (description.Length > 0)
            {
                spec = spec with { Description = description };
            }
        }

        return spec;
    }

    private static WfdbSignalSpec ParseFormat(WfdbField field, string path, string where)
    {
        var text = field.Text;
        var i = 0;
        var code = Digits(text, ref i, field, path, where, "signal format");
        if (!WfdbFormat.IsKnown(code))
        {
            Fail(path, where, $"unknown signal format code {code}", field.Offset, "format");
        }

        var spec = new WfdbSignalSpec { FileName = "", Format = code };
        if (i < text.Length && text[i] == 'x')
        {
            i++;
            var spf = Digits(text, ref i, field, path, where, "samples per frame");
            if (spf < 1)
            {
                Fail(path, where, $"samples per frame must be at least 1 ('{text}')", field.Offset + i, "samples per frame");
            }

            spec = spec with { SamplesPerFrame = spf };
        }

        if (i < text.Length && text[i] == ':')
        {
            i++;
            spec = spec with { Skew = Digits(text, ref i, field, path, where, "skew") };
        }

        if (i < text.Length && text[i] == '+')
        {
            i++;
            spec = spec with { ByteOffset = Digits(text, ref i, field, path, where, "byte offset") };
        }

        if (i < text.Length)
        {
            Fail(path, where, $"unexpected '{text[i..]}' after the signal format ('{text}')", field.Offset + i, "format");
        }

        return spec;
    }

    private static WfdbSignalSpec ParseGain(WfdbField field, string path, string where, WfdbSignalSpec spec)
    {
        var text = field.Text;
        var end = text.IndexOfAny(['(', '/']);
        var gainText = end < 0 ? text : text[..end];
        if (!WfdbHeaderParser.TryParseDouble(gainText, out var gain))
        {
            Fail(path, where, $"ADC gain is not a number ('{gainText}')", field.Offset, "ADC gain");
        }

        spec = spec with { AdcGain = gain };
        var i = end < 0 ? text.Length : end;
        if (i < text.Length && text[i] == '(')
        {
            var close = text.IndexOf(')', i);
            var inner = close < 0 ? "" : text[(i + 1)..close];
            var baseline = 0;
            if (close < 0 || !WfdbHeaderParser.TryParseInt(inner, out baseline))
            {
                Fail(path, where, $"baseline is not an integer in parentheses ('{text[i..]}')", field.Offset + i, "baseline");
            }

            spec = spec with { Baseline = baseline };
            i = close + 1;
        }

        if (i < text.Length && text[i] == '/')
        {
            var units = text[(i + 1)..];
            if (units.Length == 0)
            {
                Fail(path, where, $"units are empty after '/' ('{text}')", field.Offset + i, "units");
            }

            return spec with { Units = units };
        }

        if (i < text.Length)
        {
            Fail(path, where, $"unexpected '{text[i..]}' after the ADC gain ('{text}')", field.Offset + i, "ADC gain");
        }

        return spec;
    }

    private static int Digits(string text, ref int i, WfdbField field, string path, string where, string name)
    {
        var start = i;
        long value = 0;
        while (i < text.Length && char.IsAsciiDigit(text[i]) && value <= int.MaxValue)
        {
            value = value * 10 + (text[i] - '0');
            i++;
        }

        if (i == start || value > int.MaxValue)
        {
            Fail(path, where, $"{name} is not a number ('{text}')", field.Offset + start, name == "signal format" ? "format" : name);
        }

        return (int)value;
    }

    private static int Int(WfdbField field, string path, string where, string name, int min = int.MinValue)
    {
        if (!WfdbHeaderParser.TryParseInt(field.Text, out var value))
        {
            Fail(path, where, $"{name} is not an integer ('{field.Text}')", field.Offset, name);
        }

        if (value < min)
        {
            Fail(path, where, $"{name} must not be negative ('{field.Text}')", field.Offset, name);
        }

        return value;
    }

    [System.Diagnostics.CodeAnalysis.DoesNotReturn]
    private static void Fail(string path, string where, string problem, long offset, string field) =>
        RecordingFormatException.Throw(path, $"{where}: {problem}", offset, field);
}
