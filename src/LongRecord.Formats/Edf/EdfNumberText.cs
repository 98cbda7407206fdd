using System.Globalization;
using System.Text;

namespace LongRecord.Formats.Edf;

/// <summary>Numbers as EDF writes them: plain invariant decimals, fitted into fixed-width fields, and TAL time stamps.</summary>
internal static class EdfNumberText
{
    /// <summary>
    /// The most precise plain decimal of <paramref name="value"/> that fits in <paramref name="width"/> characters
    /// (for example −3.2768 stays "-3.2768", 1/3 becomes "0.333333"), or null when even the integer part does not fit.
    /// </summary>
    public static string? Fit(double value, int width)
    {
        if (!double.IsFinite(value))
        {
            return null;
        }

        var shortest = value.ToString("R", CultureInfo.InvariantCulture);
        if (shortest.Length <= width && !shortest.Contains('E'))
        {
            return shortest;
        }

        for (var decimals = width; decimals >= 0; decimals--)
        {
            var text = value.ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
            if (text.Contains('.'))
            {
                text = text.TrimEnd('0').TrimEnd('.');
            }

            if (text == "-0")
            {
                text = "0";
            }

            if (text.Length <= width)
            {
                return text;
            }
        }

        return null;
    }

    /// <summary>A TAL onset: sign, then seconds with up to 7 decimals (100 ns), no exponent (EDF+ 2.2.2).</summary>
    public static string Onset(double seconds) =>
        (seconds < 0 ? "-" : "+") + Math.Abs(seconds).ToString("0.#######", CultureInfo.InvariantCulture);

    /// <summary>A TAL duration: seconds, no sign.</summary>
    public static string Duration(double seconds) => seconds.ToString("0.#######", CultureInfo.InvariantCulture);

    /// <summary>The time-keeping TAL of a data record: <c>+onset 0x14 0x14 0x00</c>.</summary>
    public static byte[] TimeKeepingTal(double onsetS) => Encoding.ASCII.GetBytes(Onset(onsetS) + "\u0014\u0014\0");

    /// <summary>An annotation TAL: <c>+onset [0x15 duration] 0x14 text 0x14 0x00</c>, text in UTF-8.</summary>
    public static byte[] AnnotationTal(double onsetS, double? durationS, string text)
    {
        var head = Onset(onsetS) + (durationS is double d ? "\u0015" + Duration(d) : "") + "\u0014";
        return [.. Encoding.ASCII.GetBytes(head), .. Encoding.UTF8.GetBytes(text), 0x14, 0x00];
    }
}
