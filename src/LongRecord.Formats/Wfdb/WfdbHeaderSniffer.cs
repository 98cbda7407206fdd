using System.Text.RegularExpressions;

namespace LongRecord.Formats.Wfdb;

/// <summary>
/// Recognises a WFDB header by content: the first line that is neither blank nor a comment has the shape of a
/// header(5) record line, and the next such line, when the bytes hold it, has the shape of a signal line.
/// </summary>
internal static class WfdbHeaderSniffer
{
    private static readonly Regex s_name = new(@"^[A-Za-z0-9_\-.]+(/[0-9]+)?$", RegexOptions.CultureInvariant);
    private static readonly Regex s_count = new(@"^[0-9]+$", RegexOptions.CultureInvariant);
    private static readonly Regex s_frequency = new(
        @"^[0-9]*\.?[0-9]+([eE][-+]?[0-9]+)?\.?(/[0-9]*\.?[0-9]+([eE][-+]?[0-9]+)?\.?(\([-+0-9.eE]+\))?)?$", RegexOptions.CultureInvariant);
    private static readonly Regex s_time = new(@"^[0-9]{1,2}:[0-9]{1,2}:[0-9]{1,2}(\.[0-9]*)?$", RegexOptions.CultureInvariant);
    private static readonly Regex s_date = new(@"^[0-9]{1,2}/[0-9]{1,2}/[0-9]{1,4}$", RegexOptions.CultureInvariant);
    private static readonly Regex s_format = new(@"^[0-9]+(x[0-9]+)?(:[0-9]+)?(\+[0-9]+)?$", RegexOptions.CultureInvariant);

    public static bool LooksLikeHeader(ReadOnlySpan<byte> head)
    {
        var lines = new List<string>(2);
        var pos = 0;
        while (pos < head.Length && lines.Count < 2)
        {
            var rel = head[pos..].IndexOf((byte)'\n');
            var complete = rel >= 0;
            var line = complete ? head.Slice(pos, rel) : head[pos..];
            pos = complete ? pos + rel + 1 : head.Length;
            var trimmed = Trim(line);
            if (trimmed.IsEmpty || trimmed[0] == (byte)'#')
            {
                continue;
            }

            foreach (var b in trimmed)
            {
                if (b is not ((>= 0x20 and < 0x7F) or (byte)'\t'))
                {
                    return false;
                }
            }

            // An incomplete second line cannot be judged; an incomplete first line is judged on what is there.
            if (complete || lines.Count == 0)
            {
                lines.Add(System.Text.Encoding.ASCII.GetString(trimmed));
            }
        }

        if (lines.Count == 0)
        {
            return false;
        }

        var record = Split(lines[0]);
        if (record.Length is < 2 or > 6 || !s_name.IsMatch(record[0]) || !s_count.IsMatch(record[1]))
        {
            return false;
        }

        if ((record.Length > 2 && !s_frequency.IsMatch(record[2]))
            || (record.Length > 3 && !s_count.IsMatch(record[3]))
            || (record.Length > 4 && !s_time.IsMatch(record[4]))
            || (record.Length > 5 && !s_date.IsMatch(record[5])))
        {
            return false;
        }

        if (lines.Count < 2 || record[1] == "0")
        {
            return true;
        }

        var signal = Split(lines[1]);
        return signal.Length >= 2 && s_format.IsMatch(signal[1]);
    }

    private static string[] Split(string line) => line.Split([' ', '\t'], StringSplitOptions.RemoveEmptyEntries);

    private static ReadOnlySpan<byte> Trim(ReadOnlySpan<byte> line)
    {
        var s = 0;
        var e = line.Length;
        while (s < e && line[s] is (byte)' ' or (byte)'\t')
        {
            s++;
        }

        while (e > s && line[e - 1] is (byte)' ' or (byte)'\t' or (byte)'\r')
        {
            e--;
        }

        return line[s..e];
    }
}
