using System.Runtime.InteropServices;
using LongRecord.Analysis.Beats;

namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// The RR intervals of a beat list with a flag byte each. Index i is the interval that ends at beat i (index 0 has
/// none). Costs 5 bytes per beat: a float RR and a flag byte.
/// </summary>
internal sealed class RrSeries
{
    private readonly Beat[] _beatArray;
    private readonly int _beatOffset;

    public RrSeries(RhythmInput input, double maxBeatGapS)
    {
        Beats = input.Beats;
        // Direct array access for the hot TimeS: ReadOnlyMemory.Span costs a type check per call.
        if (MemoryMarshal.TryGetArray(input.Beats, out var segment) && segment.Array is not null)
        {
            _beatArray = segment.Array;
            _beatOffset = segment.Offset;
        }
        else
        {
            _beatArray = input.Beats.ToArray();
            _beatOffset = 0;
        }

        RateHz = input.ReferenceRateHz;
        var beats = input.Beats.Span;
        Count = beats.Length;
        RrS = new float[Count];
        Flags = new IntervalFlags[Count];
        var stretches = AnalysableStretches(input.Stretches, input.DurationS);
        var cursor = 0;
        var previousStretch = -1;
        for (var i = 0; i < Count; i++)
        {
            var t = TimeS(i);
            while (cursor < stretches.Length && stretches[cursor].EndS <= t)
            {
                cursor++;
            }

            var inStretch = cursor < stretches.Length && stretches[cursor].StartS <= t ? cursor : -1;
            if (i > 0)
            {
                if (beats[i].Sample <= beats[i - 1].Sample)
                {
                    throw new ArgumentException($"beats must be in strictly increasing sample order (beat {i})", nameof(input));
                }

                var rr = t - TimeS(i - 1);
                RrS[i] = (float)rr;
                if (inStretch >= 0 && inStretch == previousStretch && rr <= maxBeatGapS)
                {
                    Flags[i] = IntervalFlags.Analysable;
                }
            }

            previousStretch = inStretch;
        }
    }

    public ReadOnlyMemory<Beat> Beats { get; }

    public double RateHz { get; }

    public int Count { get; }

    public float[] RrS { get; }

    public IntervalFlags[] Flags { get; }

    public double TimeS(int beat) => _beatArray[_beatOffset + beat].Sample / RateHz;

    public bool Has(int interval, IntervalFlags flag) => (Flags[interval] & flag) != 0;

    public bool IsAnalysable(int interval) => interval > 0 && (Flags[interval] & IntervalFlags.Analysable) != 0;

    /// <summary>The analysable stretches sorted and merged; the whole recording when none are given.</summary>
    private static SignalStretch[] AnalysableStretches(IReadOnlyList<SignalStretch> stretches, double durationS)
    {
        if (stretches.Count == 0)
        {
            // Beats may sit a little past a duration taken from the last annotation: no upper clip.
            return [new SignalStretch(double.NegativeInfinity, double.PositiveInfinity, true)];
        }

        var list = new List<SignalStretch>();
        foreach (var s in stretches)
        {
            if (s.Analysable && s.EndS > s.StartS)
            {
                list.Add(s);
            }
        }

        list.Sort((a, b) => a.StartS.CompareTo(b.StartS));
        var merged = new List<SignalStretch>();
        foreach (var s in list)
        {
            // Touching analysable stretches are one: an interval across their border stays analysable.
            if (merged.Count > 0 && s.StartS <= merged[^1].EndS)
            {
                merged[^1] = merged[^1] with { EndS = Math.Max(merged[^1].EndS, s.EndS) };
            }
            else
            {
                merged.Add(s);
            }
        }

        return [.. merged];
    }
}
