using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Rhythm;

/// <summary>Everything the rhythm stage found, as a plain object graph (see <see cref="RhythmRows"/> for flat rows).</summary>
public sealed record RhythmResult
{
    /// <summary>The settings the analysis used.</summary>
    public required AnalysisSettings Settings { get; init; }

    /// <summary>AF, af-brief, pause and bradycardia episodes, in time order.</summary>
    public required IReadOnlyList<RhythmEpisode> Episodes { get; init; }

    /// <summary>Trend rows (hourly by default), clock-aligned when the start time is known.</summary>
    public required IReadOnlyList<TrendRow> Trend { get; init; }

    /// <summary>5-min HRV segments.</summary>
    public required IReadOnlyList<HrvSegment> HrvSegments { get; init; }

    /// <summary>Short RR-irregularity windows.</summary>
    public required IReadOnlyList<IrregularityWindow> Irregularity { get; init; }

    public required RhythmSummary Summary { get; init; }
}
