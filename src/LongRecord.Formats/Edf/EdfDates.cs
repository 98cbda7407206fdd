using System.Globalization;

namespace LongRecord.Formats.Edf;

/// <summary>The two date notations of EDF: the header's dd.mm.yy and EDF+'s dd-MMM-yyyy subfields.</summary>
internal static class EdfDates
{
    private static readonly string[] s_months = ["JAN", "FEB", "MAR", "APR", "MAY", "JUN", "JUL", "AUG", "SEP", "OCT", "NOV", "DEC"];

    /// <summary>
    /// Full year of a two-digit header year. EDF (Kemp et al. 1992, as amended for Y2K on edfplus.info) uses 1985 as the
    /// clipping date: yy = 85–99 means 1985–1999 and 00–84 means 2000–2084.
    /// </summary>
    public static int ExpandYear(int yy) => yy >= 85 ? 1900 + yy : 2000 + yy;

    /// <summary>
    /// Splits a header date or time "aa.bb.cc" into its three numbers. The third part may be the literal "yy"
    /// (EDF+ after 2084: the Startdate subfield then holds the date), returned as −1.
    /// </summary>
    public static bool TryParseTriple(string text, bool allowYy, out int a, out int b, out int c)
    {
        a = b = c = 0;
        // The spec writes '.'; ':' '/' '-' are accepted because some exporters use them (common practice, no source).
        if (text.Length != 8 || !IsSeparator(text[2]) || !IsSeparator(text[5]))
        {
            return false;
        }

        if (!TwoDigits(text, 0, out a) || !TwoDigits(text, 3, out b))
        {
            return false;
        }

        if (allowYy && text[6] == 'y' && text[7] == 'y')
        {
            c = -1;
            return true;
        }

        return TwoDigits(text, 6, out c);
    }

    /// <summary>Parses an EDF+ date subfield such as <c>02-AUG-1951</c> (month case-insensitive).</summary>
    public static bool TryParsePlusDate(string text, out DateOnly date)
    {
        date = default;
        if (text.Length != 11 || text[2] != '-' || text[6] != '-' || !TwoDigits(text, 0, out var day))
        {
            return false;
        }

        var month = Array.IndexOf(s_months, text.Substring(3, 3).ToUpperInvariant()) + 1;
        if (month == 0 || !int.TryParse(text.AsSpan(7, 4), NumberStyles.None, CultureInfo.InvariantCulture, out var year) || year < 1)
        {
            return false;
        }

        if (day < 1 || day > DateTime.DaysInMonth(year, month))
        {
            return false;
        }

        date = new DateOnly(year, month, day);
        return true;
    }

    /// <summary>Formats a date as an EDF+ subfield, for example <c>02-AUG-1951</c>.</summary>
    public static string FormatPlusDate(DateOnly date) =>
        string.Create(CultureInfo.InvariantCulture, $"{date.Day:00}-{s_months[date.Month - 1]}-{date.Year:0000}");

    private static bool IsSeparator(char c) => c is '.' or ':' or '/' or '-';

    private static bool TwoDigits(string text, int at, out int value)
    {
        value = 0;
        if (!char.IsAsciiDigit(text[at]) || !char.IsAsciiDigit(text[at + 1]))
        {
            return false;
        }

        value = (text[at] - '0') * 10 + (text[at + 1] - '0');
        return true;
    }
}
