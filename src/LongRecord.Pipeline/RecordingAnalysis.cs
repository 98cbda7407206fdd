using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Episodes;
using LongRecord.Analysis.Quality;
using LongRecord.Analysis.Rhythm;
using LongRecord.Analysis.Settings;
using LongRecord.Formats;

namespace LongRecord.Pipeline;

/// <summary>Everything the analysis found in one recording: the single result object every output is written from.</summary>
public sealed record RecordingAnalysis(
    RecordingInfo Info,
    IReadOnlyList<Beat> Beats,
    IReadOnlyList<QualityStretch> Quality,
    RhythmResult Rhythm,
    AnalysisSettings Settings,
    double ReferenceRateHz,
    double DurationS,
    IReadOnlyList<string> LeadLabels,
    string BeatSource)
{
    /// <summary>The episode stage's result: tachycardias, runs, bigeminy, pauses, urgent findings and the symptom events.</summary>
    public EpisodeResult Episodes { get; init; } = EpisodeResult.Empty;
}
