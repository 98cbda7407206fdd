namespace LongRecord.Reporting.Strips;

/// <summary>A labelled vertical marker on a strip (episode onset, end, patient event).</summary>
public readonly record struct StripMarker(double TimeS, string Label);
