namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// One trend window (by default one clock hour). Rates and HRV are NaN when the window is not
/// <see cref="Sufficient"/>: too little of it was analysable to give them (never averaged over the gap).
/// </summary>
public sealed record TrendRow
{
    public required int Index { get; init; }
    public required double StartS { get; init; }
    public required double EndS { get; init; }

    /// <summary>Clock time of the window's start, or null when the recording has no start time.</summary>
    public DateTime? ClockStart { get; init; }

    public required double AnalysableMinutes { get; init; }

    /// <summary>Analysable share reached <c>RhythmSettings.MinAnalysableFraction</c> of the window's span.</summary>
    public required bool Sufficient { get; init; }

    /// <summary>All beats in the window (analysable or not).</summary>
    public required int Beats { get; init; }

    public required double MinBpm { get; init; }
    public required double MeanBpm { get; init; }
    public required double MaxBpm { get; init; }

    /// <summary>Supraventricular ectopic beats (class S).</summary>
    public required int Sve { get; init; }

    /// <summary>Ventricular ectopic beats (class V).</summary>
    public required int Ve { get; init; }

    public required double AfMinutes { get; init; }

    /// <summary>AF minutes ÷ analysable minutes, percent.</summary>
    public required double AfBurdenPercent { get; init; }

    /// <summary>Pauses starting in the window.</summary>
    public required int Pauses { get; init; }

    public required double SdnnMs { get; init; }
    public required double RmssdMs { get; init; }
}
