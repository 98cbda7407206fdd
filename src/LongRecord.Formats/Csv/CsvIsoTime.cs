namespace LongRecord.Formats.Csv;

/// <summary>
/// ISO 8601 local date-time in the extended format, <c>2026-03-04T08:15:00</c> with an optional fraction of 1–7 digits
/// (<c>.004</c>). A space may stand for the <c>T</c> (RFC 3339 §5.6 allows it). Offsets and <c>Z</c> are not accepted:
/// the column holds the recorder's local clock.
/// </summary>
internal static class CsvIsoTime
{
    public const int MaxFractionDigits = 7;

    /// <summary>Parses <paramref name="text"/>; <paramref name="fractionDigits"/> is the number of fraction digits written.</summary>
    public static bool TryParse(ReadOnlySpan<byte> text, out DateTime value, out int fractionDigits)
    {
        value = default;
        fractionDigits = 0;
        if (text.Length < 19
            || text[4] != (byte)'-' || text[7] != (byte)'-' || (text[10] != (byte)'T' && text[10] != (byte)' ')
            || text[13] != (byte)':' || text[16] != (byte)':')
        {
            return false;
        }

        if (!Digits(text.Slice(0, 4), out var year) || !Digits(text.Slice(5, 2), out var month) || !Digits(text.Slice(8, 2), out var day)
            || !Digits(text.Slice(11, 2), out var hour) || !Digits(text.Slice(14, 2), out var minute) || !Digits(text.Slice(17, 2), out var second))
        {
            return false;
        }

        long fractionTicks = 0;
        if (text.Length > 19)
        {
            var fraction = text[20..];
            if (text[19] != (byte)'.' || fraction.Length is 0 or > MaxFractionDigits || !Digits(fraction, out var f))
            {
                return false;
            }

            fractionDigits = fraction.Length;
            fractionTicks = f;
            for (var k = fraction.Length; k < MaxFractionDigits; k++)
            {
                fractionTicks *= 10;
            }
        }

        if (year < 1 || month is < 1 or > 12 || day < 1 || day > DateTime.DaysInMonth(year, month) || hour > 23 || minute > 59 || second > 59)
        {
            return false;
        }

        value = new DateTime(year, month, day, hour, minute, second, DateTimeKind.Unspecified).AddTicks(fractionTicks);
        return true;
    }

    private static bool Digits(ReadOnlySpan<byte> text, out int value)
    {
        value = 0;
        foreach (var b in text)
        {
            var d = b - '0';
            if ((uint)d > 9)
            {
                return false;
            }

            value = value * 10 + d;
        }

        return true;
    }
}
