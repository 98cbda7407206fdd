namespace LongRecord.Reporting.Templates;

/// <summary>A page size in millimetres.</summary>
public sealed record PaperSize(string Name, double WidthMm, double HeightMm)
{
    /// <summary>ISO 216 A4, 210 × 297 mm.</summary>
    public static PaperSize A4 { get; } = new("A4", 210, 297);

    /// <summary>US Letter, 8.5 × 11 in = 215.9 × 279.4 mm.</summary>
    public static PaperSize Letter { get; } = new("Letter", 215.9, 279.4);

    public static PaperSize? FromName(string name) => name.ToUpperInvariant() switch
    {
        "A4" => A4,
        "LETTER" => Letter,
        _ => null,
    };
}
