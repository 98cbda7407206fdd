using System.Globalization;
using System.Text;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// A patient diary as CSV text: a header <c>time,text</c>, then one entry a line. <c>time</c> is seconds from the
/// first sample, or a local date-time as recorded (<c>yyyy-MM-ddTHH:mm[:ss[.fff]]</c>, a space allowed for the
/// <c>T</c>), which needs the recording's start time; <c>text</c> may be quoted (RFC 4180 quoting, commas inside).
/// Pure: parses text, reports the first problem with its byte offset.
/// </summary>
public static class DiaryText
{
    private static readonly string[] s_formats = ["yyyy-MM-ddTHH:mm:ss.FFF", "yyyy-MM-ddTHH:mm:ss", "yyyy-MM-ddTHH:mm", "yyyy-MM-dd HH:mm:ss.FFF", "yyyy-MM-dd HH:mm:ss", "yyyy-MM-dd HH:mm"];

    /// <summary>The entries of <paramref name="text"/>, or the problem and the byte offset of the line it is on.</summary>
    public static DiaryParse Parse(string text, DateTime? start)
    {
        var events = new List<SymptomEventInput>();
        var offset = 0;
        var lineNumber = 0;
        var encoding = new UTF8Encoding(false);
        foreach (var rawLine in text.Split('\n'))
        {
            lineNumber++;
            var line = rawLine.TrimEnd('\r');
            var at = offset;
            offset += encoding.GetByteCount(rawLine) + 1;
            if (lineNumber == 1)
            {
                var header = Fields(line.TrimStart('\uFEFF'));
                if (header is null || header.Count < 2 || !header[0].Trim().Equals("time", StringComparison.OrdinalIgnoreCase)
                    || !header[1].Trim().Equals("text", StringComparison.OrdinalIgnoreCase))
                {
                    return DiaryParse.Fail("diary header must be 'time,text'", at);
                }

                continue;
            }

            if (line.Trim().Length == 0)
            {
                continue;
            }

            var fields = Fields(line);
            if (fields is null || fields.Count < 2)
            {
                return DiaryParse.Fail($"diary line {lineNumber}: expected 'time,text'", at);
            }

            var timeText = fields[0].Trim();
            double timeS;
            if (double.TryParse(timeText, NumberStyles.Float, CultureInfo.InvariantCulture, out var seconds))
            {
                if (!double.IsFinite(seconds) || seconds < 0)
                {
                    return DiaryParse.Fail($"diary line {lineNumber}: time {timeText} is not a time from the start", at);
                }

                timeS = seconds;
            }
            else if (DateTime.TryParseExact(timeText, s_formats, CultureInfo.InvariantCulture, DateTimeStyles.None, out var clock))
            {
                if (start is not DateTime s0)
                {
                    return DiaryParse.Fail($"diary line {lineNumber}: a clock time needs the recording's start time, which the file does not give (use seconds from the start)", at);
                }

                timeS = (clock - s0).TotalSeconds;
                if (timeS < 0)
                {
                    return DiaryParse.Fail($"diary line {lineNumber}: {timeText} is before the recording starts", at);
                }
            }
            else
            {
                return DiaryParse.Fail($"diary line {lineNumber}: time '{timeText}' is neither seconds nor a local date-time", at);
            }

            events.Add(new SymptomEventInput(timeS, string.Join(",", fields.Skip(1)).Trim(), "diary"));
        }

        return new DiaryParse(events, null, 0);
    }

    // Splits one CSV line; null when a quote is not closed.
    private static List<string>? Fields(string line)
    {
        var fields = new List<string>();
        var sb = new StringBuilder();
        var quoted = false;
        for (var i = 0; i < line.Length; i++)
        {
            var ch = line[i];
            if (quoted)
            {
                if (ch == '"' && i + 1 < line.Length && line[i + 1] == '"')
                {
                    sb.Append('"');
                    i++;
                }
                else if (ch == '"')
                {
                    quoted = false;
                }
                else
                {
                    sb.Append(ch);
                }
            }
            else if (ch == '"')
            {
                quoted = true;
            }
            else if (ch == ',')
            {
                fields.Add(sb.ToString());
                sb.Clear();
            }
            else
            {
                sb.Append(ch);
            }
        }

        if (quoted)
        {
            return null;
        }

        fields.Add(sb.ToString());
        return fields;
    }
}

/// <summary>The entries of a diary, or its first problem and the byte offset of its line.</summary>
public sealed record DiaryParse(IReadOnlyList<SymptomEventInput> Events, string? Problem, long ByteOffset)
{
    internal static DiaryParse Fail(string problem, long offset) => new([], problem, offset);
}
