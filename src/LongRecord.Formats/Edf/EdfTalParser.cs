using System.Diagnostics.CodeAnalysis;
using System.Globalization;
using System.Runtime.CompilerServices;
using System.Text;

namespace LongRecord.Formats.Edf;

/// <summary>
/// Parses Time-stamped Annotations Lists (EDF+ section 2.2.2):
/// <c>+Onset [0x15 Duration] 0x14 Text 0x14 [Text 0x14 …] 0x00</c>, TALs back to back, the rest of the signal 0x00.
/// </summary>
internal static class EdfTalParser
{
    private const byte DurationMark = 0x15;
    private const byte TextEnd = 0x14;

    /// <summary>
    /// Adds every annotation of one annotation signal of one data record to <paramref name="events"/> (onsets as written,
    /// relative to the header's start time). Returns the record's time-keeping onset when <paramref name="timeKeeping"/>
    /// and the first TAL's first annotation is empty (EDF+ section 2.2.4), else null.
    /// </summary>
    /// <param name="regionOffset">File offset of <paramref name="region"/>, for messages.</param>
    /// <param name="record">0-based data record (messages print it 1-based).</param>
    // Called for every data record when a file is opened (hundreds of thousands in a long recording): compiled
    // optimised from its first call, since the start-up tier ran the first open of a 72 h file four times slower.
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static double? Parse(ReadOnlySpan<byte> region, bool timeKeeping, List<RecordingEvent> events, string path, long regionOffset, int record)
    {
        double? recordOnset = null;
        var pos = 0;
        var first = true;
        while (pos < region.Length && region[pos] != 0)
        {
            var onset = Number(region, ref pos, signed: true, "onset", path, regionOffset, record);
            double? duration = null;
            if (pos < region.Length && region[pos] == DurationMark)
            {
                pos++;
                duration = Number(region, ref pos, signed: false, "duration", path, regionOffset, record);
            }

            if (pos >= region.Length || region[pos] != TextEnd)
            {
                Fail($"onset{(duration is null ? "" : " and duration")} must be followed by 0x14", pos, region, path, regionOffset, record);
            }

            pos++;
            var firstText = true;
            while (true)
            {
                if (pos >= region.Length)
                {
                    Fail("TAL runs past the end of the annotation signal (no closing 0x00)", pos, region, path, regionOffset, record);
                }

                if (region[pos] == 0)
                {
                    // "+onset 0x14 0x00" (no annotation at all) is taken as time keeping too: a common slip of writers
                    // for "+onset 0x14 0x14 0x00" (common practice, no source).
                    if (first && firstText && timeKeeping)
                    {
                        recordOnset = onset;
                    }

                    pos++;
                    break;
                }

                var end = region[pos..].IndexOfAny(TextEnd, (byte)0);
                if (end < 0 || region[pos + end] == 0)
                {
                    Fail("annotation text is not closed by 0x14", pos + Math.Max(end, 0), region, path, regionOffset, record);
                }

                var text = Encoding.UTF8.GetString(region.Slice(pos, end));
                if (first && firstText && timeKeeping && text.Length == 0)
                {
                    recordOnset = onset;
                }
                else if (text.Length > 0)
                {
                    events.Add(new RecordingEvent(onset, duration, text));
                }

                firstText = false;
                pos += end + 1;
            }

            first = false;
        }

        return recordOnset;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static double Number(ReadOnlySpan<byte> region, ref int pos, bool signed, string what, string path, long regionOffset, int record)
    {
        var start = pos;
        if (signed)
        {
            if (region[pos] is not ((byte)'+' or (byte)'-'))
            {
                Fail($"{what} must begin with '+' or '-' (found {Show(region[pos])})", pos, region, path, regionOffset, record);
            }

            pos++;
        }

        var digits = 0;
        var points = 0;
        while (pos < region.Length && (char.IsAsciiDigit((char)region[pos]) || (region[pos] == '.' && points == 0)))
        {
            if (region[pos] == '.')
            {
                points++;
            }
            else
            {
                digits++;
            }

            pos++;
        }

        if (digits == 0)
        {
            Fail($"{what} has no digits", start, region, path, regionOffset, record);
        }

        return double.Parse(region[start..pos], NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture);
    }

    private static string Show(byte b) => b is >= 32 and < 127 ? $"'{(char)b}'" : $"0x{b:X2}";

    [DoesNotReturn]
    private static void Fail(string problem, int pos, ReadOnlySpan<byte> region, string path, long regionOffset, int record) =>
        throw new RecordingFormatException(path, $"bad TAL in data record {record + 1}: {problem}", regionOffset + Math.Min(pos, region.Length), "EDF Annotations");
}
