namespace LongRecord.Formats;

/// <summary>
/// One stored signal. Physical value = (digital − <see cref="Baseline"/>) ÷ <see cref="Gain"/>, in
/// <see cref="PhysicalUnit"/>; readers return it multiplied by <see cref="MillivoltsPerUnit"/> when the unit is a voltage.
/// </summary>
public sealed record ChannelInfo
{
    /// <summary>Label as written in the file (for example <c>MLII</c>, <c>ECG V5</c>).</summary>
    public required string Label { get; init; }

    /// <summary>Physical unit as written (for example <c>mV</c>, <c>uV</c>); empty when the file gives none.</summary>
    public required string PhysicalUnit { get; init; }

    /// <summary>Samples per second of this channel.</summary>
    public required double SamplingRateHz { get; init; }

    /// <summary>Samples of this channel on the elapsed-time axis, gaps included.</summary>
    public required long SampleCount { get; init; }

    /// <summary>Digital units per physical unit.</summary>
    public required double Gain { get; init; }

    /// <summary>Digital value that corresponds to a physical value of zero.</summary>
    public required double Baseline { get; init; }

    /// <summary>Smallest digital value the recorder can store (saturation limit).</summary>
    public required int DigitalMin { get; init; }

    /// <summary>Largest digital value the recorder can store (saturation limit).</summary>
    public required int DigitalMax { get; init; }

    /// <summary>Transducer description, when the format has one.</summary>
    public string Transducer { get; init; } = "";

    /// <summary>Pre-filtering description, when the format has one.</summary>
    public string Prefilter { get; init; } = "";

    /// <summary>Factor from the physical unit to millivolts, or NaN when the unit is not a voltage.</summary>
    public double MillivoltsPerUnit => VoltageUnits.MillivoltsPer(PhysicalUnit);

    /// <summary>True when readers return this channel in millivolts.</summary>
    public bool IsVoltage => !double.IsNaN(MillivoltsPerUnit);

    /// <summary>One quantisation step in the unit readers return (mV for voltages).</summary>
    public double Resolution => (IsVoltage ? MillivoltsPerUnit : 1.0) / Math.Abs(Gain);
}
