namespace LongRecord.Cli.Progress;

/// <summary>How much a batch says as it goes.</summary>
public enum ProgressLevel
{
    /// <summary><c>--quiet</c>: errors only (on stderr).</summary>
    Quiet,

    /// <summary>A line per recording finished, skipped or failed, and a closing count.</summary>
    Normal,

    /// <summary><c>--verbose</c>: also when each analysis starts and why it runs, and full traces of internal faults.</summary>
    Verbose,
}

/// <summary>The batch's display options from the command line.</summary>
/// <param name="Timings"><c>--timings</c>: time per stage for each recording and summed over the batch.</param>
public sealed record ProgressSettings(ProgressLevel Level, bool Timings);
