namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// One episode found by the rhythm stage: AF (at least the minimum duration), a brief AF-like stretch, a pause or a
/// bradycardia. Times are seconds from the first sample; an AF or bradycardia episode runs from the R of its first
/// beat to the R of its last, a pause from the R before it to the R after it.
/// </summary>
public sealed record RhythmEpisode
{
    /// <summary>Kind words as written in episodes.csv.</summary>
    public const string AfKind = "af", AfBriefKind = "af-brief", PauseKind = "pause", BradycardiaKind = "bradycardia";

    /// <summary>af, af-brief, pause or bradycardia.</summary>
    public required string Kind { get; init; }

    public required double StartS { get; init; }
    public required double EndS { get; init; }
    public double DurationS => EndS - StartS;

    /// <summary>Beats from first to last, both counted (a pause: the two beats around it).</summary>
    public required int Beats { get; init; }

    /// <summary>Mean rate over the episode, bpm (60 × intervals ÷ time).</summary>
    public required double MeanBpm { get; init; }

    /// <summary>Highest rate over the episode on the averaged rate (see <c>RhythmSettings.RateAveragingBeats</c>), bpm; NaN for a pause.</summary>
    public required double MaxBpm { get; init; }

    /// <summary>Lowest averaged rate over the episode, bpm; NaN for a pause.</summary>
    public double MinBpm { get; init; } = double.NaN;

    /// <summary>False when the episode was already under way where the analysable record (or a stretch of it) begins.</summary>
    public bool OnsetObserved { get; init; } = true;

    /// <summary>False when the episode was still under way where the analysable record (or a stretch of it) ends.</summary>
    public bool OffsetObserved { get; init; } = true;

    /// <summary>Pauses: at or above the highlight length.</summary>
    public bool Highlighted { get; init; }

    /// <summary>Pauses: what came before the pause.</summary>
    public PauseContext Context { get; init; }

    /// <summary>Pauses: a P wave with no QRS lies inside the pause (from the beats stage): possible AV block.</summary>
    public bool PossibleAvBlock { get; init; }
}

/// <summary>What a pause followed.</summary>
public enum PauseContext
{
    /// <summary>Not a pause, or a pause in an otherwise regular rhythm.</summary>
    None,

    /// <summary>The pause lies inside AF (or an AF-like stretch).</summary>
    DuringAf,

    /// <summary>The pause follows a premature beat (by class or by RR).</summary>
    AfterPremature,
}
