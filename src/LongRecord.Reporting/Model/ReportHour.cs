namespace LongRecord.Reporting.Model;

/// <summary>One trend window (a clock hour). Rates are NaN when too little of the hour was analysable.</summary>
public sealed record ReportHour
{
    public required double StartS { get; init; }
    public required double EndS { get; init; }
    public DateTime? ClockStart { get; init; }
    public required double AnalysablePercent { get; init; }
    public required bool Sufficient { get; init; }
    public required double MinBpm { get; init; }
    public required double MeanBpm { get; init; }
    public required double MaxBpm { get; init; }
    public required double AfBurdenPercent { get; init; }
    public required int Sve { get; init; }
    public required int Ve { get; init; }
    public required int Pauses { get; init; }
}
