namespace LongRecord.Reporting.Model;

/// <summary>
/// The whole-recording figures, each exactly as summary.json writes it (same rounding); null where summary.json has
/// null. Field names follow summary.json's keys.
/// </summary>
public sealed record ReportFigures
{
    public required int TotalBeats { get; init; }
    public required double? AnalysablePercent { get; init; }
    public required double? AnalysableS { get; init; }
    public required double? RecordingS { get; init; }

    public required double? HrMinBpm { get; init; }
    public required double? HrMeanBpm { get; init; }
    public required double? HrMaxBpm { get; init; }

    /// <summary>Where the averaged rate was lowest and highest (null when no rate was measured).</summary>
    public required ReportPeriod? Slowest { get; init; }
    public required ReportPeriod? Fastest { get; init; }

    public required double? AfBurdenPercent { get; init; }
    public required int AfEpisodeCount { get; init; }
    public required int AfBriefCount { get; init; }
    public required double? AfLongestS { get; init; }
    public required bool AfAtStart { get; init; }
    public required bool AfAtEnd { get; init; }

    /// <summary>AF burden per 24 h from the start, percent (null when a day had no analysable time).</summary>
    public required IReadOnlyList<double?> AfBurdenPerDayPercent { get; init; }

    public required int PauseCount { get; init; }
    public required int PauseHighlightedCount { get; init; }
    public required double? PauseLongestS { get; init; }
    public required int BradycardiaCount { get; init; }

    /// <summary>Beats per EC57 class letter (N, S, V, F, Q).</summary>
    public required IReadOnlyList<KeyValuePair<string, int>> BeatsByClass { get; init; }

    /// <summary>Ectopic runs (couplets, runs) when an episodes stage counted them; null when not analysed.</summary>
    public IReadOnlyList<KeyValuePair<string, int>>? EctopicRuns { get; init; }

    public required double? SdnnMs { get; init; }
    public required double? SdannMs { get; init; }
    public required double? SdnnIndexMs { get; init; }
    public required double? RmssdMs { get; init; }
    public required double? Pnn50Percent { get; init; }
    public required double? HrvTriangularIndex { get; init; }
    public required double? LfMs2 { get; init; }
    public required double? HfMs2 { get; init; }
    public required double? LfHfRatio { get; init; }
    public required double? HrvExcludedS { get; init; }
}

/// <summary>A stretch of averaged rate: where the slowest or fastest rate was measured.</summary>
public sealed record ReportPeriod(double StartS, double EndS, double Bpm);
