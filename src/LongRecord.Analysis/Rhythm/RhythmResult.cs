using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Rhythm;

/// <summary>Everything the rhythm stage found, as a plain object graph.</summary>
public sealed record RhythmResult
{
    /// <summary>The settings the analysis used.</summary>
    public required AnalysisSettings Settings { get; init; }

    /// <summary>AF, af-brief, pause and bradycardia episodes, in time order.</summary>
    public required IReadOnlyList<RhythmEpisode> Episodes { get; init; }
}
