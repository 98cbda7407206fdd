namespace LongRecord.Reporting.Model;

/// <summary>A patient event (diary entry or button press) and the rhythm the analysis found at that moment.</summary>
/// <param name="Rhythm">Kind of the episode covering the event, or a phrase saying none did.</param>
/// <param name="RateBpm">Mean rate of the beats around the event, or NaN when none were analysable.</param>
public sealed record ReportSymptom(double TimeS, string Text, string Rhythm, double RateBpm);
