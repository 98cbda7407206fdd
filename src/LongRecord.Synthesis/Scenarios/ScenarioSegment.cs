namespace LongRecord.Synthesis.Scenarios;

/// <summary>One rhythm segment of the timeline. Parameters a rhythm does not use are null; defaults are applied by the scheduler.</summary>
public sealed record ScenarioSegment
{
    public required RhythmKind Rhythm { get; init; }
    public required double DurationS { get; init; }

    /// <summary>Ventricular (or, for flutter and dissociated P waves, atrial) rate; for sinus, a fixed rate instead of the circadian one.</summary>
    public double? RateBpm { get; init; }

    /// <summary>Sinus tachycardia: seconds to ramp up to <see cref="RateBpm"/> and back down.</summary>
    public double? RampUpS { get; init; }
    public double? RampDownS { get; init; }

    /// <summary>Ectopic P shape (focal atrial tachycardia): inverted, biphasic, narrow-upright, peaked.</summary>
    public string? PShape { get; init; }
    public int? WarmUpBeats { get; init; }

    /// <summary>PSVT: draw a small retrograde P wave in the ST segment.</summary>
    public bool? RetrogradeP { get; init; }

    /// <summary>PSVT, broad-complex tachycardia: pause after the last beat before sinus resumes, seconds.</summary>
    public double? EndPauseS { get; init; }

    /// <summary>Flutter: atrial rate; broad-complex tachycardia: rate of the dissociated sinus P waves.</summary>
    public double? AtrialRateBpm { get; init; }

    /// <summary>Flutter: 2:1, 3:1, 4:1 or variable.</summary>
    public string? Conduction { get; init; }

    /// <summary>Second-degree AV block: P waves to conducted beats, for example 3:2.</summary>
    public string? ConductionRatio { get; init; }

    /// <summary>Coefficient of variation of RR (AF, MAT).</summary>
    public double? RrCv { get; init; }

    /// <summary>Scale of the fibrillatory wave amplitude (AF), 1 = catalogue level.</summary>
    public double? FibrillatoryWaveScale { get; init; }

    public bool? AvDissociation { get; init; }

    /// <summary>Ventricular bigeminy/trigeminy: PVC coupling interval as a fraction of the sinus RR.</summary>
    public double? CouplingFraction { get; init; }

    /// <summary>PVC / VT shape: ventricular-a or ventricular-b.</summary>
    public string? Morphology { get; init; }

    public EctopySettings? Ectopy { get; init; }
    public IReadOnlyList<SegmentEvent> Events { get; init; } = [];
}

/// <summary>Random ectopy in a sinus segment, as rates per hour.</summary>
public sealed record EctopySettings
{
    public double PacPerHour { get; init; }
    public double PvcPerHour { get; init; }
    public double PvcCoupletsPerHour { get; init; }
    public double VeRunsPerHour { get; init; }
    public double SveRunsPerHour { get; init; }
    public int RunBeatsMin { get; init; } = 3;
    public int RunBeatsMax { get; init; } = 6;

    /// <summary>Fraction of PVCs from the second focus (ventricular-b).</summary>
    public double SecondFocusFraction { get; init; }
}

/// <summary>What a scripted event in a sinus segment does.</summary>
public enum SegmentEventKind
{
    /// <summary>Premature atrial beat; <c>count</c> ≥ 2 makes a couplet or an SVE run.</summary>
    Pac,

    /// <summary>Premature ventricular beat; <c>count</c> ≥ 2 makes a couplet or a VE run.</summary>
    Pvc,

    /// <summary>Sinus arrest: no P, no QRS for <c>durationS</c> (R to R).</summary>
    Pause,

    /// <summary>A sinus P wave with no QRS after it.</summary>
    BlockedP,
}

/// <summary>An event placed at the first sinus beat due at or after <see cref="AtS"/> seconds from the segment start.</summary>
public sealed record SegmentEvent
{
    public required double AtS { get; init; }
    public required SegmentEventKind Kind { get; init; }
    public int Count { get; init; } = 1;
    public double? RateBpm { get; init; }
    public double? DurationS { get; init; }
    public string? Morphology { get; init; }
    public string? PShape { get; init; }
}
