using LongRecord.Analysis.Rhythm;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// One episode for review: its kind (one of <see cref="EpisodeKinds.All"/>), extent, rates, the evidence its class
/// rests on, how it began and ended, and why (and where) a reviewer should look at it. Times are seconds from the
/// first sample; a beat episode runs from the R of its first beat to the R of its last, a pause from the R before it
/// to the R after it, a signal stretch (vf, signal-loss) over the stretch.
/// </summary>
public sealed record Episode
{
    /// <summary>1, 2, … in time order.</summary>
    public int Id { get; init; }

    public required string Kind { get; init; }
    public required double StartS { get; init; }
    public required double EndS { get; init; }
    public double DurationS => EndS - StartS;

    /// <summary>Beats from first to last, both counted (a pause: the two beats around it; a signal stretch: 0).</summary>
    public required int Beats { get; init; }

    public double MeanBpm { get; init; } = double.NaN;
    public double MaxBpm { get; init; } = double.NaN;
    public double MinBpm { get; init; } = double.NaN;

    /// <summary>False when the episode was already under way where the analysable record (or a stretch of it) begins.</summary>
    public bool OnsetObserved { get; init; } = true;

    /// <summary>False when the episode was still under way where the analysable record (or a stretch of it) ends.</summary>
    public bool OffsetObserved { get; init; } = true;

    /// <summary>Pauses: at or above the highlight length (from the rhythm stage).</summary>
    public bool Highlighted { get; init; }

    /// <summary>Pauses: what came before the pause (from the rhythm stage).</summary>
    public PauseContext Context { get; init; }

    /// <summary>Pauses: a P wave with no QRS lies inside the pause (from the rhythm stage).</summary>
    public bool PossibleAvBlock { get; init; }

    /// <summary>Median QRS width of the episode's beats, ms (the mean complex's width when the beats carry none); NaN when unknown.</summary>
    public double QrsMs { get; init; } = double.NaN;

    public QrsWidth Width { get; init; }

    /// <summary><c>regular</c>, <c>irregular</c>, or empty when not judged.</summary>
    public string Regularity { get; init; } = "";

    /// <summary>Coefficient of variation of the episode's RR intervals.</summary>
    public double RrCv { get; init; } = double.NaN;

    /// <summary>EC57 run class of an SVE or VE run: <c>run-3-5</c> or <c>run-6+</c> (couplets are counted, not listed); empty otherwise.</summary>
    public string RunClass { get; init; } = "";

    public OnsetMeasure? Onset { get; init; }
    public OffsetMeasure? Offset { get; init; }
    public AtrialFinding Atrial { get; init; } = AtrialFinding.NotMeasured;

    /// <summary>The measured facts the kind rests on, in words (semicolon-separated).</summary>
    public string Evidence { get; init; } = "";

    /// <summary>0 … 1: how clearly the evidence points at this kind.</summary>
    public double Confidence { get; init; } = 1;

    /// <summary>Possible ventricular tachycardia or fibrillation, or signal lost on every lead: to be seen first.</summary>
    public bool Urgent { get; init; }

    /// <summary>Why a reviewer should look: <c>urgent</c>, <c>broad-complex</c>, <c>longest</c>, <c>fastest</c>, <c>slowest</c>, <c>first-onset</c>, <c>symptom</c>, <c>low-confidence</c>, <c>long-pause</c>.</summary>
    public IReadOnlyList<string> Reasons { get; init; } = [];

    /// <summary>Flagged: at least one review reason.</summary>
    public bool Flagged => Reasons.Count > 0;

    /// <summary>Review order, 1 first (flagged before others, urgent first).</summary>
    public int Rank { get; init; }

    /// <summary>Id of the group's representative (itself when it represents the group).</summary>
    public int Group { get; init; }

    /// <summary>Episodes in the group (shown once, with this count).</summary>
    public int GroupSize { get; init; } = 1;

    /// <summary>The onset with context on both sides.</summary>
    public Strip OnsetStrip { get; init; }

    /// <summary>The offset with context on both sides (the same strip as the onset for a short episode).</summary>
    public Strip OffsetStrip { get; init; }

    /// <summary>Indices into the symptom-event table of the events near this episode.</summary>
    public IReadOnlyList<int> SymptomEvents { get; init; } = [];
}
