namespace LongRecord.Analysis.Episodes;

/// <summary>One row of the symptom-event table: the event and the rhythm and rate around it.</summary>
/// <param name="TimeS">Seconds from the first sample.</param>
/// <param name="ClockTime">Local clock time as recorded, or null when the recording has no start time.</param>
/// <param name="Text">The event's text.</param>
/// <param name="Source"><c>recording</c> or <c>diary</c>.</param>
/// <param name="Rhythm">Kinds of the episodes within the window (most urgent first, <c>+</c>-joined), or <c>no-episode</c>, or <c>no-beats</c>.</param>
/// <param name="MeanBpm">Mean rate of the analysable beats within the window, NaN when none.</param>
/// <param name="MinBpm">Slowest beat-to-beat rate within the window.</param>
/// <param name="MaxBpm">Fastest beat-to-beat rate within the window.</param>
/// <param name="EpisodeIds">Episodes overlapping the window.</param>
public sealed record SymptomEvent(double TimeS, DateTime? ClockTime, string Text, string Source, string Rhythm, double MeanBpm, double MinBpm, double MaxBpm, IReadOnlyList<int> EpisodeIds);
