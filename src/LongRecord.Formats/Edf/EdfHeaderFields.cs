using System.Diagnostics.CodeAnalysis;
using System.Globalization;
using System.Text;

namespace LongRecord.Formats.Edf;

/// <summary>
/// Reads the fixed-width ASCII fields of an EDF/BDF header and turns every malformed value into a
/// <see cref="RecordingFormatException"/> that names the field and its byte offset.
/// </summary>
internal sealed class EdfHeaderFields(string path, byte[] bytes)
{
    public string Path { get; } = path;

    /// <summary>The field as written, trailing spaces (and NULs some writers leave) removed.</summary>
    public string Text(int offset, int width) => Encoding.Latin1.GetString(bytes, offset, width).TrimEnd(' ', '\0');

    /// <summary>An integer field; <paramref name="what"/> is the message prefix, for example <c>header field 'number of signals'</c>.</summary>
    public int Integer(int offset, int width, string what, string field)
    {
        var text = Text(offset, width).Trim();
        if (TryParseInteger(text, out var value))
        {
            return value;
        }

        return Fail($"{what} is not a number ('{text}')", offset, field);
    }

    /// <summary>A real-number field (plain decimal notation, invariant culture).</summary>
    public double Real(int offset, int width, string what, string field)
    {
        var text = Text(offset, width).Trim();
        if (TryParseReal(text, out var value))
        {
            return value;
        }

        return Fail($"{what} is not a number ('{text}')", offset, field);
    }

    [DoesNotReturn]
    public int Fail(string problem, long offset, string field) =>
        throw new RecordingFormatException(Path, problem, offset, field);

    /// <summary>
    /// Integers may carry a sign; a zero fraction ("250.0") is accepted because some writers emit one
    /// (common practice, no source). Exponents, digit grouping and decimal commas are rejected.
    /// </summary>
    internal static bool TryParseInteger(string text, out int value)
    {
        value = 0;
        if (!TryParseReal(text, out var real) || real != Math.Floor(real) || real < int.MinValue || real > int.MaxValue)
        {
            return false;
        }

        value = (int)real;
        return true;
    }

    /// <summary>EDF numbers are ASCII decimals: optional sign, digits, optional point and digits (EDF spec, "never use a digit grouping symbol").</summary>
    internal static bool TryParseReal(string text, out double value)
    {
        value = 0;
        if (text.Length == 0)
        {
            return false;
        }

        var i = text[0] is '+' or '-' ? 1 : 0;
        var digits = 0;
        var points = 0;
        for (; i < text.Length; i++)
        {
            var c = text[i];
            if (c is >= '0' and <= '9')
            {
                digits++;
            }
            else if (c == '.' && points == 0)
            {
                points++;
            }
            else
            {
                return false;
            }
        }

        return digits > 0 && double.TryParse(text, NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture, out value);
    }
}
