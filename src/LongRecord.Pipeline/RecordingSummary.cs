namespace LongRecord.Pipeline;

/// <summary>What one summarised recording produced.</summary>
public sealed record RecordingSummary(string Name, string OutputFolder, double DurationS, double ReferenceRateHz, int Leads, int Beats);
