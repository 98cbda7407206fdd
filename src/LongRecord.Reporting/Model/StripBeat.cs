namespace LongRecord.Reporting.Model;

/// <summary>A beat inside a strip: its time and its class letter.</summary>
public readonly record struct StripBeat(double TimeS, char Label);
