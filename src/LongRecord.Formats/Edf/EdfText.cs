using System.Globalization;

namespace LongRecord.Formats.Edf;

internal static class EdfText
{
    /// <summary>Shortest round-trip invariant text of a number, for messages.</summary>
    public static string ToInvariant(this double value) => value.ToString("R", CultureInfo.InvariantCulture);
}
