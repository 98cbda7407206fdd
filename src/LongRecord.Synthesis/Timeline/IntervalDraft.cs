using LongRecord.Synthesis.Truth;

namespace LongRecord.Synthesis.Timeline;

/// <summary>A rhythm interval being filled while its beats are scheduled.</summary>
internal sealed class IntervalDraft
{
    public required string Kind { get; init; }
    public required byte Label { get; init; }
    public required OnsetType Onset { get; init; }
    public required OnsetType Offset { get; init; }
    public required bool IsEpisode { get; init; }
    public required int SegmentIndex { get; init; }
    public Dictionary<string, double> Parameters { get; } = new(StringComparer.Ordinal);
    public Dictionary<string, string> Settings { get; } = new(StringComparer.Ordinal);

    /// <summary>Explicit extent for intervals without beats (ventricular flutter/fibrillation, pauses).</summary>
    public double? FixedStartS { get; set; }
    public double? FixedEndS { get; set; }

    public double FirstRS { get; set; } = double.NaN;
    public double LastRS { get; set; } = double.NaN;
    public int BeatCount { get; set; }

    /// <summary>Beat times, kept only where a parameter needs them after the fact (sinus tachycardia).</summary>
    public List<double>? BeatTimes { get; set; }

    public double StartS => FixedStartS ?? FirstRS;
    public double EndS => FixedEndS ?? LastRS;
    public bool IsEmpty => FixedStartS is null && BeatCount == 0;
}
