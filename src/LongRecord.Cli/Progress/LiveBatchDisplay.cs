using System.Collections.Concurrent;
using System.Runtime.ExceptionServices;
using LongRecord.Pipeline.Batch;
using LongRecord.Pipeline.Inputs;
using Spectre.Console;

namespace LongRecord.Cli.Progress;

/// <summary>
/// The batch on a terminal: an overall bar and a line per recording being analysed (Spectre.Console). Spectre's
/// display is not thread-safe, so workers only queue events and the calling thread alone draws. Failures, the closing
/// count and timings are printed when the display ends; errors also go to stderr then, as one line each.
/// </summary>
public sealed class LiveBatchDisplay(IAnsiConsole console, TextWriter stderr, ProgressSettings settings) : IBatchProgress
{
    private readonly BlockingCollection<Action<ProgressContext>> _events = new();
    private readonly Dictionary<string, ProgressTask> _running = new(StringComparer.Ordinal);
    private readonly ConcurrentQueue<BatchEntry> _failed = new();
    private ProgressTask? _overall;

    public void Planned(int found, int inThisRun, ShardSpec shard) => _events.Add(ctx =>
    {
        _overall!.MaxValue = Math.Max(1, inThisRun);
        _overall.Description = Markup.Escape(shard.IsWhole ? $"{inThisRun} recording(s)" : $"shard {shard}: {inThisRun} of {found} recording(s)");
    });

    public void Started(RecordingInput input, string reason) => _events.Add(ctx =>
    {
        var task = ctx.AddTask(Markup.Escape(BatchNames.Display(input)), autoStart: true);
        task.IsIndeterminate = true;
        _running[input.OutputName] = task;
    });

    public void Finished(BatchEntry entry)
    {
        if (entry.Status == BatchStatus.Failed)
        {
            _failed.Enqueue(entry);
        }

        _events.Add(ctx =>
        {
            if (_running.Remove(entry.Input.OutputName, out var task))
            {
                ctx.RemoveTask(task);
            }

            _overall!.Increment(1);
            if (settings.Level == ProgressLevel.Verbose || entry.Status == BatchStatus.Failed)
            {
                console.MarkupLine(Markup.Escape(RecordingLine.Of(entry)));
            }
        });
    }

    /// <summary>Runs <paramref name="work"/> on a worker thread while this thread draws its progress.</summary>
    public BatchResult Run(Func<IBatchProgress, BatchResult> work)
    {
        BatchResult? result = null;
        ExceptionDispatchInfo? error = null;
        console.Progress()
            .AutoClear(false)
            .HideCompleted(false)
            .Columns(new TaskDescriptionColumn { Alignment = Justify.Left }, new ProgressBarColumn(), new PercentageColumn(), new ElapsedTimeColumn(), new SpinnerColumn())
            .Start(ctx =>
            {
                _overall = ctx.AddTask("recordings", autoStart: true, maxValue: 1);
                var worker = Task.Run(() =>
                {
                    try
                    {
                        result = work(this);
                    }
                    catch (Exception e)
                    {
                        error = ExceptionDispatchInfo.Capture(e);
                    }
                    finally
                    {
                        _events.CompleteAdding();
                    }
                });
                foreach (var apply in _events.GetConsumingEnumerable())
                {
                    apply(ctx);
                    ctx.Refresh();
                }

                worker.Wait();
            });
        error?.Throw();
        Completed(result!);
        return result!;
    }

    private void Completed(BatchResult result)
    {
        foreach (var f in _failed)
        {
            stderr.WriteLine(f.Reason);
        }

        if (settings.Timings)
        {
            var table = new Table().AddColumn("stage").AddColumn(new TableColumn("seconds").RightAligned());
            var timings = result.TotalTimings();
            foreach (var (stage, s) in timings.Stages)
            {
                table.AddRow(Markup.Escape(stage), s.ToString("F2", System.Globalization.CultureInfo.InvariantCulture));
            }

            // Parts of a beats stage that ran on two threads: thread time, overlapping, outside the sum above.
            foreach (var (stage, s) in timings.OverlappedParts)
            {
                table.AddRow(Markup.Escape("  beats: " + stage + " (thread time)"), s.ToString("F2", System.Globalization.CultureInfo.InvariantCulture));
            }

            console.Write(table);
        }

        if (settings.Level != ProgressLevel.Quiet)
        {
            console.MarkupLine(Markup.Escape(RecordingLine.Closing(result)));
        }
    }
}
