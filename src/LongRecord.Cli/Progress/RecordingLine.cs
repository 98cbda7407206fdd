using System.Globalization;
using LongRecord.Pipeline.Batch;

namespace LongRecord.Cli.Progress;

/// <summary>The words of a recording's line, shared by the plain log and the live display (relative paths only).</summary>
public static class RecordingLine
{
    public static string Of(BatchEntry e) => e.Status switch
    {
        BatchStatus.Done when e.Summary is { } s => string.Create(CultureInfo.InvariantCulture,
            $"{e.DisplayName}: {s.Beats} beats over {s.DurationS / 3600:0.##} h, {(s.SignalAnalysed ? $"{s.Leads} lead(s) at {s.ReferenceRateHz:0.###} Hz" : "from annotations only, no signal")}{(s.BeatSource == "detected" ? "" : $" (beats from {Path.GetFileName(s.BeatSource)})")} → {s.OutputFolder} ({e.ElapsedS:0.0} s)"),
        BatchStatus.Unchanged => $"{e.DisplayName}: unchanged, skipped ({e.Reason}; --force re-runs it)",
        _ => $"{e.DisplayName}: failed: {e.Reason}",
    };

    public static string Closing(BatchResult r) => string.Create(CultureInfo.InvariantCulture,
        $"{r.Entries.Count} recording(s){(r.Shard.IsWhole ? "" : $" in shard {r.Shard} of {r.Found}")}: {r.Done} analysed, {r.Unchanged} unchanged, {r.Failed} failed; index {r.IndexHtmlPath}");
}
