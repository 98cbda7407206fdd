namespace LongRecord.Synthesis.Scenarios;

/// <summary>Kinds of noise a stretch can add.</summary>
public enum NoiseKind
{
    BaselineWander,
    Muscle,
    ElectrodeMotion,
    LeadOff,
}

/// <summary>How a lead-off stretch looks.</summary>
public enum LeadOffMode
{
    /// <summary>Flat line at exactly 0 mV.</summary>
    Flat,

    /// <summary>Saturated at +rail.</summary>
    RailHigh,

    /// <summary>Saturated at −rail.</summary>
    RailLow,
}

/// <summary>A noise stretch, timed from the start of the timeline (repeated with it when the timeline repeats).</summary>
public sealed record NoiseStretch
{
    public required NoiseKind Kind { get; init; }
    public required double StartS { get; init; }
    public required double DurationS { get; init; }

    /// <summary>Signal-to-noise ratio in dB (see <c>NoiseCalibration</c> for the formula); null for lead-off.</summary>
    public double? SnrDb { get; init; }

    /// <summary>Lead labels affected; empty means every lead.</summary>
    public IReadOnlyList<string> Leads { get; init; } = [];

    public LeadOffMode Mode { get; init; } = LeadOffMode.Flat;
    public double RailMv { get; init; } = 5.0;
}
