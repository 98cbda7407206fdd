namespace LongRecord.Formats.Csv;

/// <summary>A lead column of the header: <c>II (mV)</c> gives label <c>II</c> and unit <c>mV</c>.</summary>
/// <param name="Label">Name without the unit.</param>
/// <param name="Unit">Unit from the brackets, or <c>mV</c> when the header gives none.</param>
/// <param name="HeaderText">The header cell as written, for messages.</param>
internal sealed record CsvColumn(string Label, string Unit, string HeaderText)
{
    public const string DefaultUnit = "mV";

    /// <summary>Splits a trailing <c>(unit)</c> or <c>[unit]</c> off <paramref name="cell"/>; unit is null when absent.</summary>
    public static (string Label, string? Unit) SplitUnit(string cell)
    {
        var text = cell.Trim();
        if (text.Length >= 2 && (text[^1] == ')' || text[^1] == ']'))
        {
            var open = text.LastIndexOf(text[^1] == ')' ? '(' : '[');
            if (open >= 0)
            {
                var unit = text[(open + 1)..^1].Trim();
                return (text[..open].Trim(), unit.Length > 0 ? unit : null);
            }
        }

        return (text, null);
    }
}
