namespace LongRecord.Reporting.Model;

/// <summary>
/// Everything one report shows, already measured: the Pipeline builds it from the same analysis result that
/// <c>summary.json</c> is written from, and the renderers only lay it out. Times are seconds from the first sample.
/// </summary>
public sealed record ReportModel
{
    public required ReportPatient Patient { get; init; }

    public required ReportRecording Recording { get; init; }

    public required ReportFigures Figures { get; init; }

    /// <summary>One row per trend window (clock hour), in time order.</summary>
    public required IReadOnlyList<ReportHour> Hours { get; init; }

    /// <summary>Every episode, in rank order (rank 1 first).</summary>
    public required IReadOnlyList<ReportEpisode> Episodes { get; init; }

    /// <summary>Patient events (diary entries, button presses) with the rhythm found at each.</summary>
    public required IReadOnlyList<ReportSymptom> Symptoms { get; init; }

    public required RhythmDistributions Distributions { get; init; }

    /// <summary>Episode counts per kind, in the order kinds first appear.</summary>
    public required IReadOnlyList<KeyValuePair<string, int>> EpisodeCounts { get; init; }

    /// <summary>Episodes flagged for review, every one counted (the table shows a group of similar episodes once).</summary>
    public int? FlaggedEpisodeCount { get; init; }

    public required ReportThresholds Thresholds { get; init; }

    /// <summary>Version of the tool that analysed the recording (as in summary.json).</summary>
    public required string ToolVersion { get; init; }
}
