namespace LongRecord.Synthesis;

/// <summary>Overrides of the scenario's own settings for one synthesis run; null keeps the scenario's value.</summary>
public sealed record SynthesisOptions
{
    /// <summary>Samples per second, 100 to 1000.</summary>
    public double? SamplingRateHz { get; init; }

    public ulong? Seed { get; init; }

    /// <summary>Repeat the timeline cyclically, or cut it, to exactly this many hours (at most 14 days).</summary>
    public double? Hours { get; init; }

    public DateTime? StartDateTime { get; init; }

    /// <summary>What <see cref="SyntheticRecording.Render(long, int, System.Span{float})"/> includes by default.</summary>
    public SignalComponents Components { get; init; } = SignalComponents.All;
}
