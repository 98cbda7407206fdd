namespace LongRecord.Pipeline;

/// <summary>What one summarised recording produced.</summary>
/// <param name="BeatSource">Where the beats came from: <c>detected</c>, or the annotation file they were taken from.</param>
/// <param name="SignalAnalysed">False when the beats were taken from annotations with no signal to measure them on.</param>
public sealed record RecordingSummary(string Name, string OutputFolder, double DurationS, double ReferenceRateHz, int Leads, int Beats, string BeatSource, bool SignalAnalysed)
{
    /// <summary>The rhythm stage's result, the same object summary.json was written from.</summary>
    public LongRecord.Analysis.Rhythm.RhythmResult? Rhythm { get; init; }
}
