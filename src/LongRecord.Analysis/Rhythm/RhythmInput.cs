using LongRecord.Analysis.Beats;

namespace LongRecord.Analysis.Rhythm;

/// <summary>What the rhythm stage reads: the beat list and the facts of the recording it came from.</summary>
public sealed record RhythmInput
{
    /// <summary>Beats in time order, positions at <see cref="ReferenceRateHz"/>.</summary>
    public required ReadOnlyMemory<Beat> Beats { get; init; }

    /// <summary>The reference rate f_ref of <see cref="Beat.Sample"/>, Hz.</summary>
    public required double ReferenceRateHz { get; init; }

    /// <summary>Local clock time of the first sample, or null when the file gives none (windows then follow elapsed hours).</summary>
    public DateTime? StartDateTime { get; init; }

    /// <summary>
    /// Length of the recording, seconds. For an annotation-only record (a zero-signal header) use the last
    /// annotation's time.
    /// </summary>
    public required double DurationS { get; init; }

    /// <summary>Stretches judged by the quality stage. Empty: the whole recording is analysable. Time no stretch covers is not analysable.</summary>
    public IReadOnlyList<SignalStretch> Stretches { get; init; } = [];

    /// <summary>
    /// Hook for the beats stage: sample positions (at f_ref) of P waves that no QRS followed. A pause holding one is
    /// marked as possible AV block. Empty when not known.
    /// </summary>
    public IReadOnlyList<long> NonConductedPSamples { get; init; } = [];

    /// <summary>
    /// Hook for a fibrillatory-wave measure: one score per beat (0 = clear P/no f waves … 1 = f waves), NaN when not
    /// judged. Empty when the signal gave none.
    /// </summary>
    public ReadOnlyMemory<float> FWaveScores { get; init; }
}
