namespace LongRecord.Formats;

/// <summary>A timed event stored in the recording (EDF+ annotation, patient button, diary text).</summary>
/// <param name="OnsetS">Seconds of elapsed recording time from the first sample.</param>
/// <param name="DurationS">Duration in seconds, or null when the file gives none.</param>
/// <param name="Text">The event's text as written.</param>
public readonly record struct RecordingEvent(double OnsetS, double? DurationS, string Text);
