namespace LongRecord.Analysis.Rhythm;

/// <summary>A stretch of the recording the quality stage judged, in seconds from the first sample.</summary>
/// <param name="StartS">Start, seconds.</param>
/// <param name="EndS">End, seconds (exclusive).</param>
/// <param name="Analysable">True when beats and rhythm can be read in it.</param>
/// <param name="Reason">Why it is not analysable (noise, lead-off…), or empty.</param>
public sealed record SignalStretch(double StartS, double EndS, bool Analysable, string Reason = "");
