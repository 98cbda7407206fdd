using LongRecord.Pipeline.Inputs;

namespace LongRecord.Pipeline.Batch;

/// <summary>
/// What a batch tells its display as it goes. Calls come from the worker threads, several at once: an
/// implementation serialises them itself.
/// </summary>
public interface IBatchProgress
{
    /// <summary>Before any work: how many recordings were found and how many this run (or shard) takes.</summary>
    void Planned(int found, int inThisRun, ShardSpec shard);

    /// <summary>A recording's analysis begins (its fingerprint did not match), with the reason it runs.</summary>
    void Started(RecordingInput input, string reason);

    /// <summary>A recording is done, unchanged or failed.</summary>
    void Finished(BatchEntry entry);
}
