using System.Globalization;
using System.Text;

namespace LongRecord.Formats.Tests.Csv;

/// <summary>
/// Writes CSV recordings as text in the test, with .NET's invariant number formatting, so reader tests do not depend on
/// the library's writer. Values: lead k, row i → <see cref="Value"/>, written with 4 decimals.
/// </summary>
internal static class CsvTestText
{
    public static double Value(int lead, long row) => Math.Round(1.2 * Math.Sin(2 * Math.PI * row / (83.0 + 7 * lead)) + 0.01 * lead, 4);

    /// <summary>Header <c>time_s,L1 (mV),…</c> and rows at <paramref name="rateHz"/>, times with <paramref name="timeFormat"/>.</summary>
    public static string Seconds(double rateHz, int rows, int leads = 2, string timeFormat = "F6", string separator = ",",
        string prologue = "", Func<long, double>? time = null)
    {
        var text = new StringBuilder(prologue);
        text.Append("time_s");
        for (var k = 0; k < leads; k++)
        {
            text.Append(separator).Append("L").Append(k + 1).Append(" (mV)");
        }

        text.Append('\n');
        for (long i = 0; i < rows; i++)
        {
            var t = time?.Invoke(i) ?? i / rateHz;
            text.Append(t.ToString(timeFormat, CultureInfo.InvariantCulture));
            for (var k = 0; k < leads; k++)
            {
                text.Append(separator).Append(Value(k, i).ToString("F4", CultureInfo.InvariantCulture));
            }

            text.Append('\n');
        }

        return text.ToString();
    }

    /// <summary>The same rows with ISO 8601 local date-times from <paramref name="start"/>, 3 fraction digits.</summary>
    public static string Iso(DateTime start, double rateHz, int rows, int leads = 1)
    {
        var text = new StringBuilder("time");
        for (var k = 0; k < leads; k++)
        {
            text.Append(",L").Append(k + 1);
        }

        text.Append('\n');
        for (long i = 0; i < rows; i++)
        {
            var t = start.AddTicks((long)Math.Round(i * TimeSpan.TicksPerSecond / rateHz));
            text.Append(t.ToString("yyyy-MM-dd'T'HH:mm:ss.fff", CultureInfo.InvariantCulture));
            for (var k = 0; k < leads; k++)
            {
                text.Append(',').Append(Value(k, i).ToString("F4", CultureInfo.InvariantCulture));
            }

            text.Append('\n');
        }

        return text.ToString();
    }

    public static byte[] Bytes(string text) => Encoding.UTF8.GetBytes(text);

    /// <summary>Byte offset of the start of 1-based line <paramref name="line"/> in <paramref name="text"/>.</summary>
    public static long OffsetOfLine(string text, int line)
    {
        var offset = 0;
        for (var l = 1; l < line; l++)
        {
            offset = text.IndexOf('\n', offset) + 1;
        }

        return Encoding.UTF8.GetByteCount(text.AsSpan(0, offset));
    }
}
