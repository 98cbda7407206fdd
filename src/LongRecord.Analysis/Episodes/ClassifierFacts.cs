namespace LongRecord.Analysis.Episodes;

/// <summary>What the classifier knows about a candidate: everything measured, nothing from any truth.</summary>
internal sealed record ClassifierFacts
{
    public required double DurationS { get; init; }
    public required double MeanBpm { get; init; }
    public required double MedianBpm { get; init; }

    /// <summary>Median of the beats' own QRS widths, ms; NaN when none measured.</summary>
    public required double BeatQrsMs { get; init; }

    /// <summary>Width of the episode's mean complex on the signal, ms; NaN when not measured.</summary>
    public required double MeanComplexQrsMs { get; init; }

    /// <summary>Share of beats of class V, of class S, and premature (S, V or the beats stage's premature flag).</summary>
    public required double VShare { get; init; }
    public required double SShare { get; init; }

    /// <summary>Share of beats of class N.</summary>
    public required double NShare { get; init; }
    public required double PrematureShare { get; init; }

    /// <summary>Share of beats in the recording's usual conducted-QRS template; NaN when templates are unknown.</summary>
    public required double UsualQrsShare { get; init; }

    /// <summary>Share of beats whose morphology template the recording holds fewer than three beats of (a false detection's mark).</summary>
    public required double OddTemplateShare { get; init; }

    /// <summary>
    /// Share of the fast intervals that, added to a neighbouring one, make up the RR before the candidate within 10 %:
    /// an extra detection splitting a normal interval.
    /// </summary>
    public required double SplitShare { get; init; }

    public required RrRegularity Regularity { get; init; }

    /// <summary>Regularity of the intervals between two normal beats (the rhythm under the premature beats).</summary>
    public required RrRegularity NormalRegularity { get; init; }
    public required OnsetMeasure Onset { get; init; }
    public required OffsetMeasure Offset { get; init; }
    public required AtrialFinding Atrial { get; init; }

    /// <summary>Share of the candidate's time inside the rhythm stage's AF or af-brief episodes.</summary>
    public required double AfShare { get; init; }

    /// <summary>At least one of the rhythm stage's AF episodes inside is <c>af</c> (long enough), not only <c>af-brief</c>.</summary>
    public required bool RhythmAfLong { get; init; }

    /// <summary>The candidate includes a consecutive run of S or V beats.</summary>
    public required CandidateSource Source { get; init; }
}
