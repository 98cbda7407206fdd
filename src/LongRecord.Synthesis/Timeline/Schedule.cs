namespace LongRecord.Synthesis.Timeline;

/// <summary>Everything the scheduler decided: complexes sorted by time, continuous sources, rhythm intervals.</summary>
internal sealed record Schedule(Complex[] Complexes, ContinuousSource[] Sources, IReadOnlyList<IntervalDraft> Intervals);
