namespace LongRecord.Formats;

/// <summary>A stretch of elapsed time with no stored samples (EDF+D). Readers return NaN there.</summary>
/// <param name="StartS">Seconds of elapsed time from the first sample.</param>
/// <param name="DurationS">Length of the gap in seconds.</param>
public readonly record struct RecordingGap(double StartS, double DurationS)
{
    public double EndS => StartS + DurationS;
}
