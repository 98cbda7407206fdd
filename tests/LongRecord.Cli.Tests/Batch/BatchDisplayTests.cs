using LongRecord.Cli.Progress;
using LongRecord.Pipeline.Batch;
using LongRecord.Pipeline.Inputs;
using Spectre.Console;

namespace LongRecord.Cli.Tests.Batch;

/// <summary>
/// The batch's displays (batch issue, "Progress"): plain time-stamped lines when redirected, the Spectre live display
/// on a terminal, quiet and verbose, and recordings named by relative path only.
/// </summary>
public sealed class BatchDisplayTests
{
    private static readonly RecordingInput s_good = new("/data/Surname Firstname/night/a/rec.edf", "a/rec.edf", "rec", "rec");
    private static readonly RecordingInput s_bad = new("/data/Surname Firstname/night/b/cut.edf", "b/cut.edf", "cut", "cut");

    [Fact]
    public void PlainLog_LinesStampedInUtcIso8601_FailuresAlsoOnStderr()
    {
        var (stdout, stderr) = (new StringWriter(), new StringWriter());
        var log = new PlainBatchLog(stdout, stderr, new ProgressSettings(ProgressLevel.Normal, Timings: false), new FixedClock());
        Feed(log);
        var lines = stdout.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries);
        // ISO 8601 extended format, UTC designator Z (ISO 8601-1:2019, 5.3.3 and 5.4.2).
        Assert.All(lines, l => Assert.StartsWith("2026-12-02T01:02:03Z ", l));
        Assert.Contains(lines, l => l.EndsWith("[1/2] a/rec.edf: unchanged, skipped (fingerprint matches; --force re-runs it)", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.EndsWith("[2/2] b/cut.edf: failed: b/cut.edf: file ends early at byte 300", StringComparison.Ordinal));
        Assert.Equal("b/cut.edf: file ends early at byte 300", stderr.ToString().Trim());
        Assert.DoesNotContain("analysing", stdout.ToString());
        Assert.DoesNotContain("Surname", stdout.ToString() + stderr);
    }

    [Fact]
    public void Quiet_PrintsErrorsOnly_Verbose_AlsoEachStartAndWhy()
    {
        var (stdout, stderr) = (new StringWriter(), new StringWriter());
        Feed(new PlainBatchLog(stdout, stderr, new ProgressSettings(ProgressLevel.Quiet, Timings: false)));
        Assert.Equal("", stdout.ToString());
        Assert.Equal("b/cut.edf: file ends early at byte 300", stderr.ToString().Trim());

        stdout = new StringWriter();
        Feed(new PlainBatchLog(stdout, new StringWriter(), new ProgressSettings(ProgressLevel.Verbose, Timings: false)));
        Assert.Contains("b/cut.edf: analysing (no earlier result)", stdout.ToString());
        Assert.Contains("2 recording(s) found", stdout.ToString());
    }

    [Fact]
    public void LiveDisplay_DrawsFromEventsOfOtherThreads_ThenPrintsFailuresAndTheCount()
    {
        var screen = new StringWriter();
        var stderr = new StringWriter();
        var console = AnsiConsole.Create(new AnsiConsoleSettings
        {
            Ansi = AnsiSupport.No,
            ColorSystem = ColorSystemSupport.NoColors,
            Interactive = InteractionSupport.Yes,
            Out = new AnsiConsoleOutput(screen),
        });
        var display = new LiveBatchDisplay(console, stderr, new ProgressSettings(ProgressLevel.Normal, Timings: true));
        var result = display.Run(p =>
        {
            var worker = new Thread(() => Feed(p));
            worker.Start();
            worker.Join();
            return Result();
        });

        Assert.Equal(2, result.Entries.Count);
        Assert.Contains("b/cut.edf: failed: b/cut.edf: file ends early at byte 300", screen.ToString());
        Assert.Contains("2 recording(s): 0 analysed, 1 unchanged, 1 failed", screen.ToString());
        Assert.Equal("b/cut.edf: file ends early at byte 300", stderr.ToString().Trim());
        Assert.DoesNotContain("Surname", screen.ToString());
    }

    private static void Feed(IBatchProgress p)
    {
        p.Planned(2, 2, ShardSpec.All);
        var entries = Result().Entries;
        p.Finished(entries[0]);
        p.Started(s_bad, "no earlier result");
        p.Finished(entries[1]);
        if (p is PlainBatchLog log)
        {
            log.Completed(Result());
        }
    }

    private static BatchResult Result() => new(2, ShardSpec.All,
        [new BatchEntry(s_good, BatchStatus.Unchanged, "fingerprint matches"), new BatchEntry(s_bad, BatchStatus.Failed, "b/cut.edf: file ends early at byte 300")],
        "/out/index.csv", "/out/index.html");

    private sealed class FixedClock : TimeProvider
    {
        public override DateTimeOffset GetUtcNow() => new(2026, 12, 2, 1, 2, 3, TimeSpan.Zero);
    }
}
