using System.Globalization;
using LongRecord.Pipeline.Batch;
using LongRecord.Pipeline.Inputs;

namespace LongRecord.Cli.Progress;

/// <summary>
/// The batch as plain time-stamped lines (UTC) on stdout, for logs and redirected output; each failure also as its
/// one-line error on stderr. Lines name recordings by relative path only. Safe to call from several workers at once.
/// </summary>
public sealed class PlainBatchLog(TextWriter stdout, TextWriter stderr, ProgressSettings settings, TimeProvider? clock = null) : IBatchProgress
{
    private readonly Lock _lock = new();
    private readonly TimeProvider _clock = clock ?? TimeProvider.System;
    private int _total;
    private int _finished;

    public void Planned(int found, int inThisRun, ShardSpec shard)
    {
        _total = inThisRun;
        if (settings.Level == ProgressLevel.Verbose)
        {
            Line(shard.IsWhole ? $"{found} recording(s) found" : $"{found} recording(s) found; shard {shard} takes {inThisRun}");
        }
    }

    public void Started(RecordingInput input, string reason)
    {
        if (settings.Level == ProgressLevel.Verbose)
        {
            Line($"{BatchNames.Display(input)}: analysing ({reason})");
        }
    }

    public void Finished(BatchEntry entry)
    {
        lock (_lock)
        {
            _finished++;
            if (entry.Status == BatchStatus.Failed)
            {
                stderr.WriteLine(entry.Reason);
                if (settings.Level == ProgressLevel.Verbose && entry.Fault is not null)
                {
                    stderr.WriteLine(entry.Fault.ToString());
                }
            }

            if (settings.Level != ProgressLevel.Quiet)
            {
                Line(string.Create(CultureInfo.InvariantCulture, $"[{_finished}/{_total}] {RecordingLine.Of(entry)}"));
            }

            if (settings.Timings && entry.Timings is not null)
            {
                Line($"{entry.DisplayName}: timings {entry.Timings}");
            }
        }
    }

    /// <summary>The closing count (and batch timings) once the index is written.</summary>
    public void Completed(BatchResult result)
    {
        if (settings.Timings)
        {
            Line($"timings over {result.Done} analysed recording(s): {result.TotalTimings()}");
        }

        if (settings.Level != ProgressLevel.Quiet)
        {
            Line(RecordingLine.Closing(result));
        }
    }

    private void Line(string text)
    {
        lock (_lock)
        {
            stdout.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{_clock.GetUtcNow():yyyy-MM-ddTHH:mm:ssZ} {text}"));
        }
    }
}
