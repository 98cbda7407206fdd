using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Rhythm;

namespace LongRecord.Analysis.Episodes;

/// <summary>What the episode stage reads: the beats, the quality stretches, the rhythm stage's result and the events.</summary>
public sealed record EpisodeInput
{
    /// <summary>Beats in time order, positions at <see cref="ReferenceRateHz"/>.</summary>
    public required ReadOnlyMemory<Beat> Beats { get; init; }

    public required double ReferenceRateHz { get; init; }

    public required double DurationS { get; init; }

    /// <summary>Local clock time of the first sample, or null (then diary times must be seconds from the start).</summary>
    public DateTime? StartDateTime { get; init; }

    /// <summary>
    /// Stretches judged by the quality stage, with their reason codes as in <c>quality.csv</c> (<c>chaotic-all-leads</c>
    /// and <c>flat-all-leads</c> become urgent episodes). Empty: the whole recording is analysable.
    /// </summary>
    public IReadOnlyList<SignalStretch> Stretches { get; init; } = [];

    /// <summary>The rhythm stage's result (AF, pauses, bradycardia).</summary>
    public required RhythmResult Rhythm { get; init; }

    /// <summary>Symptom events (EDF+ annotations, diary entries), any order.</summary>
    public IReadOnlyList<SymptomEventInput> Events { get; init; } = [];
}

/// <summary>One symptom event as recorded.</summary>
/// <param name="TimeS">Seconds from the first sample.</param>
/// <param name="Text">What was written or pressed.</param>
/// <param name="Source"><c>recording</c> (an annotation in the file) or <c>diary</c>.</param>
public sealed record SymptomEventInput(double TimeS, string Text, string Source);
