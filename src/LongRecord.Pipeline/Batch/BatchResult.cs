namespace LongRecord.Pipeline.Batch;

/// <summary>The outcome of one batch run (or shard): an entry per recording it took, in input order, and its index files.</summary>
public sealed record BatchResult(int Found, ShardSpec Shard, IReadOnlyList<BatchEntry> Entries, string IndexCsvPath, string IndexHtmlPath)
{
    public int Done => Entries.Count(e => e.Status == BatchStatus.Done);

    public int Unchanged => Entries.Count(e => e.Status == BatchStatus.Unchanged);

    public int Failed => Entries.Count(e => e.Status == BatchStatus.Failed);

    public bool AnyInternalFault => Entries.Any(e => e.InternalFault);

    /// <summary>Stage times summed over the recordings analysed in this run.</summary>
    public StageTimings TotalTimings()
    {
        var total = new StageTimings();
        foreach (var e in Entries)
        {
            if (e.Timings is not null)
            {
                total.AddAll(e.Timings);
            }
        }

        return total;
    }
}
