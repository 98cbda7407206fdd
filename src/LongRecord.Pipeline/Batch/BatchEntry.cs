using LongRecord.Pipeline.Inputs;

namespace LongRecord.Pipeline.Batch;

/// <summary>What happened to one recording of a batch.</summary>
public enum BatchStatus
{
    /// <summary>Analysed in this run; its folder is complete.</summary>
    Done,

    /// <summary>Skipped: its folder's fingerprint matches everything that shapes its outputs.</summary>
    Unchanged,

    /// <summary>Could not be analysed; no folder was written for it in this run.</summary>
    Failed,
}

/// <summary>One recording's line of the batch.</summary>
/// <param name="Reason">Failed: the one-line error, naming files by their path relative to the input root. Done: why it
/// was analysed (no earlier result, input content changed, settings changed, --force…).</param>
public sealed record BatchEntry(RecordingInput Input, BatchStatus Status, string Reason)
{
    /// <summary>How the recording is named in logs and the index: its relative path (no patient identifiers from
    /// folders above the input root).</summary>
    public string DisplayName => BatchNames.Display(Input);

    public RecordingSummary? Summary { get; init; }

    public StageTimings? Timings { get; init; }

    public double ElapsedS { get; init; }

    /// <summary>The failure was a fault of LongRecord itself, not of the recording.</summary>
    public bool InternalFault { get; init; }

    /// <summary>The exception of an internal fault, for the full trace in a verbose log.</summary>
    public Exception? Fault { get; init; }
}

/// <summary>Names of recordings in everything a batch prints or writes.</summary>
public static class BatchNames
{
    /// <summary>The recording's path relative to its input root, with '/' separators.</summary>
    public static string Display(RecordingInput input) => input.RelativePath.Replace('\\', '/');
}
