namespace LongRecord.Synthesis.Truth;

/// <summary>
/// Ground truth for one rhythm stretch. <see cref="Kind"/> is the scenario rhythm name (sinus, af, psvt…) or an
/// episode inside a segment (sve-couplet, sve-run, ve-couplet, ve-run, pause). Beat-carrying intervals run from the
/// R time of their first beat to the R time of their last; ventricular flutter/fibrillation run over the scripted
/// stretch; a pause runs from the R before it to the R after it.
/// </summary>
public sealed record RhythmInterval
{
    public required string Kind { get; init; }

    /// <summary>WFDB-style rhythm label such as <c>(AFIB</c>, or null for episodes that carry none (couplets, pauses).</summary>
    public string? Label { get; init; }

    public required double StartS { get; init; }
    public required double EndS { get; init; }
    public required long StartSample { get; init; }
    public required long EndSample { get; init; }
    public required OnsetType Onset { get; init; }
    public required OnsetType Offset { get; init; }

    /// <summary>True for an episode inside a segment (run, couplet, pause), false for a timeline segment.</summary>
    public required bool IsEpisode { get; init; }

    /// <summary>Index of the scenario segment it came from.</summary>
    public required int SegmentIndex { get; init; }

    public required int BeatCount { get; init; }

    /// <summary>The parameters used (defaults filled in), with units in the names.</summary>
    public required IReadOnlyDictionary<string, double> Parameters { get; init; }

    public IReadOnlyDictionary<string, string> Settings { get; init; } = new Dictionary<string, string>();

    public double DurationS => EndS - StartS;
}

/// <summary>Ground truth for one noise stretch.</summary>
public sealed record NoiseInterval
{
    /// <summary>baseline-wander, muscle, electrode-motion or lead-off.</summary>
    public required string Kind { get; init; }
    public required double StartS { get; init; }
    public required double EndS { get; init; }
    public required long StartSample { get; init; }
    public required long EndSample { get; init; }

    /// <summary>Signal-to-noise ratio in dB by the formula in <c>NoiseCalibration</c>; null for lead-off.</summary>
    public double? SnrDb { get; init; }

    public required IReadOnlyList<string> Leads { get; init; }

    /// <summary>flat, rail-high or rail-low for lead-off, else null.</summary>
    public string? LeadOffMode { get; init; }
}
