namespace LongRecord.Pipeline;

/// <summary>What a summary run does beyond the defaults.</summary>
public sealed record SummaryOptions
{
    /// <summary>Samples per lead read and analysed at a time (results do not depend on it).</summary>
    public int BlockSamples { get; init; } = 1 << 16;
}
