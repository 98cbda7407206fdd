namespace LongRecord.Analysis.Conditioning;

/// <summary>Corner frequencies of the conditioning stage.</summary>
public sealed record ConditioningSettings
{
    public static ConditioningSettings Default { get; } = new();

    /// <summary>High-pass corner for baseline-wander removal, Hz.</summary>
    public double HighPassHz { get; init; } = 0.5;

    /// <summary>Mains frequencies to notch out, Hz.</summary>
    public IReadOnlyList<double> MainsHz { get; init; } = [50.0, 60.0];

    /// <summary>Quality factor of each notch (centre frequency ÷ −3 dB bandwidth); 30 keeps the notch about 2 Hz wide.</summary>
    public double NotchQ { get; init; } = 30;
}
