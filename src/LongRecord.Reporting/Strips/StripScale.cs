namespace LongRecord.Reporting.Strips;

/// <summary>Paper speed and gain of a drawn strip.</summary>
public readonly record struct StripScale(double MmPerS, double MmPerMv)
{
    /// <summary>25 mm/s and 10 mm/mV: the trade's standard paper speed and gain.</summary>
    public static StripScale Full { get; } = new(25, 10);

    /// <summary>Half speed and half gain for thumbnails (12.5 mm/s, 5 mm/mV), so a thumbnail shows twice the time.</summary>
    public static StripScale Thumbnail { get; } = new(12.5, 5);

    public string Caption => FormattableString.Invariant($"{MmPerS:0.#} mm/s, {MmPerMv:0.#} mm/mV");
}
