namespace LongRecord.Pipeline.Batch;

/// <summary>How a batch runs, beyond what each recording's summary does (<see cref="Summary"/>).</summary>
public sealed record BatchOptions
{
    /// <summary>What every recording's summary does; the whole record goes into each fingerprint.</summary>
    public SummaryOptions Summary { get; init; } = new();

    /// <summary>Recordings analysed at once (<c>--jobs</c>; default the number of cores).</summary>
    public int Jobs { get; init; } = Environment.ProcessorCount;

    /// <summary>Which part of the whole sorted input list this run takes (<c>--shard I/N</c>).</summary>
    public ShardSpec Shard { get; init; } = ShardSpec.All;

    /// <summary>Re-analyse even when a recording's fingerprint matches (<c>--force</c>).</summary>
    public bool Force { get; init; }
}
