using System.Globalization;
using System.Text;
using LongRecord.Formats.IO;

namespace LongRecord.Formats.Wfdb;

/// <summary>Parses header(5) text line by line; every error names the line, the field and its byte offset.</summary>
internal static class WfdbHeaderParser
{
    private const int MaxHeaderBytes = 1 << 20;

    public static WfdbHeader ParseFile(string path)
    {
        using var file = ReadOnlyRecordingFile.Open(path);
        if (file.Length > MaxHeaderBytes)
        {
            RecordingFormatException.Throw(path, $"file is larger than {MaxHeaderBytes} bytes, too large for a WFDB header", MaxHeaderBytes);
        }

        var bytes = new byte[file.Length];
        file.ReadExactly(0, bytes, "the header");

        // Latin-1 maps each byte to one char, so character offsets are byte offsets.
        return Parse(Encoding.Latin1.GetString(bytes), path);
    }

    public static WfdbHeader Parse(string text, string path)
    {
        var comments = new List<string>();
        var infoStrings = new List<string>();
        var signals = new List<WfdbSignalSpec>();
        WfdbRecordLine? record = null;

        foreach (var line in WfdbHeaderLine.Split(text))
        {
            var content = line.Text.AsSpan().Trim(" \t");
            if (content.IsEmpty)
            {
                continue;
            }

            if (content[0] == '#')
            {
                var comment = content[1..].Trim(" \t").ToString();
                comments.Add(comment);
                if (record is not null && signals.Count == record.SignalCount)
                {
                    infoStrings.Add(comment);
                }

                continue;
            }

            if (record is null)
            {
                record = WfdbRecordLine.Parse(line, path);
            }
            else if (signals.Count < record.SignalCount)
            {
                signals.Add(WfdbSignalLineParser.Parse(line, path));
            }

            // header(5): signal lines beyond the declared number are not read.
        }

        if (record is null)
        {
            RecordingFormatException.Throw(path, "no record line (the file holds only comments or blank lines)", text.Length, "record line");
        }

        if (signals.Count < record.SignalCount)
        {
            RecordingFormatException.Throw(
                path,
                $"record line: number of signals is {record.SignalCount} but the header has {signals.Count} signal specification lines",
                record.SignalCountOffset,
                "number of signals");
        }

        return new WfdbHeader
        {
            FilePath = path,
            RecordName = record.Name,
            SignalCount = record.SignalCount,
            SamplingFrequencyHz = record.SamplingFrequencyHz,
            CounterFrequencyHz = record.CounterFrequencyHz,
            BaseCounterValue = record.BaseCounterValue,
            SamplesPerSignal = record.SamplesPerSignal,
            SamplesPerSignalByteOffset = record.SamplesPerSignalOffset,
            BaseTime = record.BaseTime,
            BaseDate = record.BaseDate,
            Signals = signals,
            Comments = comments,
            InfoStrings = infoStrings,
        };
    }

    /// <summary>Parses a decimal integer the way header fields write it (optional sign, digits only).</summary>
    internal static bool TryParseInt(string s, out int value) =>
        int.TryParse(s, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out value);

    internal static bool TryParseLong(string s, out long value) =>
        long.TryParse(s, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out value);

    /// <summary>Parses a finite floating-point number in any form scanf(3) takes for %f (360, 360., 3.6e2).</summary>
    internal static bool TryParseDouble(string s, out double value) =>
        double.TryParse(s, NumberStyles.Float, CultureInfo.InvariantCulture, out value) && double.IsFinite(value);
}
