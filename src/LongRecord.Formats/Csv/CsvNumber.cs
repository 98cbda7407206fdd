using System.Buffers.Text;

namespace LongRecord.Formats.Csv;

/// <summary>Parses invariant decimal numbers straight from UTF-8 bytes, without allocating.</summary>
internal static class CsvNumber
{
    private static readonly double[] s_powersOfTen =
    [
        1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22,
    ];

    /// <summary>
    /// Parses <paramref name="text"/> (digits, optional sign, point and exponent; or the literal <c>NaN</c>).
    /// <paramref name="decimals"/> is the number of decimal places the text carries (exponent included), 0 … 30.
    /// </summary>
    public static bool TryParse(ReadOnlySpan<byte> text, out double value, out int decimals)
    {
        value = 0;
        decimals = 0;
        var i = 0;
        var negative = false;
        if (text.Length > 0 && (text[0] == (byte)'-' || text[0] == (byte)'+'))
        {
            negative = text[0] == (byte)'-';
            i = 1;
        }

        ulong mantissa = 0;
        var significant = 0;
        var digits = 0;
        for (; i < text.Length && IsDigit(text[i]); i++, digits++)
        {
            Accumulate(ref mantissa, ref significant, text[i]);
        }

        if (i < text.Length && text[i] == (byte)'.')
        {
            for (i++; i < text.Length && IsDigit(text[i]); i++, digits++, decimals++)
            {
                Accumulate(ref mantissa, ref significant, text[i]);
            }
        }

        if (i == text.Length && digits > 0 && significant <= 15 && decimals < s_powersOfTen.Length)
        {
            // Both operands are exact doubles (mantissa < 10^15 < 2^53), so one division gives the correctly rounded
            // result (Clinger's fast path).
            var magnitude = mantissa / s_powersOfTen[decimals];
            value = negative ? -magnitude : magnitude;
            return true;
        }

        return TryParseSlow(text, out value, ref decimals);
    }

    private static bool TryParseSlow(ReadOnlySpan<byte> text, out double value, ref int decimals)
    {
        if (text.SequenceEqual("NaN"u8))
        {
            value = double.NaN;
            decimals = 0;
            return true;
        }

        if (!Utf8Parser.TryParse(text, out value, out var consumed) || consumed != text.Length || !double.IsFinite(value) || !HasDigit(text))
        {
            return false;
        }

        var e = text.IndexOfAny((byte)'e', (byte)'E');
        if (e >= 0 && Utf8Parser.TryParse(text[(e + 1)..], out int exponent, out _))
        {
            decimals = Math.Clamp(decimals - exponent, 0, 30);
        }

        return true;
    }

    private static void Accumulate(ref ulong mantissa, ref int significant, byte digit)
    {
        if (mantissa == 0 && digit == (byte)'0')
        {
            return;
        }

        significant++;
        if (significant <= 19)
        {
            mantissa = mantissa * 10 + (ulong)(digit - '0');
        }
    }

    private static bool HasDigit(ReadOnlySpan<byte> text)
    {
        foreach (var b in text)
        {
            if (IsDigit(b))
            {
                return true;
            }
        }

        return false;
    }

    private static bool IsDigit(byte b) => (uint)(b - '0') <= 9;
}
