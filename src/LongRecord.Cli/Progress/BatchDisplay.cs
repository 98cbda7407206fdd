using LongRecord.Pipeline.Batch;
using Spectre.Console;

namespace LongRecord.Cli.Progress;

/// <summary>Chooses the batch's display: live on an interactive terminal, plain time-stamped lines otherwise.</summary>
public static class BatchDisplay
{
    /// <summary>Runs <paramref name="work"/> with the display that suits <paramref name="stdout"/>.</summary>
    public static BatchResult Run(TextWriter stdout, TextWriter stderr, ProgressSettings settings, Func<IBatchProgress, BatchResult> work)
    {
        if (settings.Level != ProgressLevel.Quiet && IsInteractiveConsole(stdout))
        {
            return new LiveBatchDisplay(AnsiConsole.Console, stderr, settings).Run(work);
        }

        var log = new PlainBatchLog(stdout, stderr, settings);
        var result = work(log);
        log.Completed(result);
        return result;
    }

    // Only the real console, not redirected, and one Spectre judges interactive; a test's writer is never live.
    private static bool IsInteractiveConsole(TextWriter stdout) =>
        ReferenceEquals(stdout, Console.Out) && !Console.IsOutputRedirected && AnsiConsole.Profile.Capabilities.Interactive;
}
