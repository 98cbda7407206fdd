namespace LongRecord.Reporting.Model;

/// <summary>
/// Gives the renderer the signal of one strip window at a time (the Pipeline reads it from the recording), so the
/// report never holds more than one window of signal.
/// </summary>
public interface IStripSource
{
    /// <summary>Labels of the leads each window holds, in order.</summary>
    IReadOnlyList<string> LeadLabels { get; }

    /// <summary>
    /// The signal from <paramref name="startS"/> for <paramref name="durationS"/> seconds (clipped to the recording).
    /// The returned object may be reused by the next call.
    /// </summary>
    StripSignal Read(double startS, double durationS);
}
