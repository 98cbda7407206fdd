namespace LongRecord.Reporting.Model;

/// <summary>
/// One row of the episode table. The report's own type: whichever stage finds episodes is mapped into it.
/// </summary>
public sealed record ReportEpisode
{
    /// <summary>Kind word as the analysis writes it (af, af-brief, pause, bradycardia, …).</summary>
    public required string Kind { get; init; }

    public required double StartS { get; init; }
    public required double EndS { get; init; }
    public double DurationS => EndS - StartS;

    public required int Beats { get; init; }

    /// <summary>Mean rate, bpm (NaN when not meaningful).</summary>
    public required double RateBpm { get; init; }

    /// <summary>Highest averaged rate, bpm, or NaN.</summary>
    public double MaxBpm { get; init; } = double.NaN;

    /// <summary>Median QRS width, ms, or NaN when not measured.</summary>
    public double QrsMs { get; init; } = double.NaN;

    /// <summary><c>narrow</c>, <c>broad</c> or empty when not judged.</summary>
    public string QrsClass { get; init; } = "";

    /// <summary><c>regular</c>, <c>irregular</c> or empty when not judged.</summary>
    public string Regularity { get; init; } = "";

    public bool OnsetObserved { get; init; } = true;
    public bool OffsetObserved { get; init; } = true;

    /// <summary>Why the episode got its class, in the analysis' words.</summary>
    public required string Evidence { get; init; }

    /// <summary>Shown as a strip for review.</summary>
    public required bool Flagged { get; init; }

    /// <summary>Needs attention before the others.</summary>
    public bool Urgent { get; init; }

    /// <summary>1 = reviewed first.</summary>
    public required int Rank { get; init; }
}
