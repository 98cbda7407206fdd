using System.Runtime.InteropServices;
using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Rhythm;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// The beats as the episode stage sees them: times and the RR interval ending at each beat, NaN where the interval is
/// not analysable (the first beat, an interval across unanalysable signal or longer than the beat-gap limit). Costs
/// 4 bytes per beat besides the beats themselves.
/// </summary>
internal sealed class BeatTrack
{
    private readonly Beat[] _beats;
    private readonly int _offset;
    private readonly Dictionary<short, int> _templateCounts = [];
    private readonly Dictionary<short, int> _templateVCounts = [];

    public BeatTrack(ReadOnlyMemory<Beat> beats, double referenceRateHz, IReadOnlyList<SignalStretch> stretches, double maxBeatGapS)
    {
        if (MemoryMarshal.TryGetArray(beats, out var segment) && segment.Array is not null)
        {
            _beats = segment.Array;
            _offset = segment.Offset;
        }
        else
        {
            _beats = beats.ToArray();
            _offset = 0;
        }

        Count = beats.Length;
        RateHz = referenceRateHz;
        var normal = new Dictionary<short, int>();
        foreach (ref readonly var b in beats.Span)
        {
            if (b.Template >= 0)
            {
                _templateCounts[b.Template] = _templateCounts.GetValueOrDefault(b.Template) + 1;
                if (b.Class == BeatClass.N)
                {
                    normal[b.Template] = normal.GetValueOrDefault(b.Template) + 1;
                }
                else if (b.Class == BeatClass.V)
                {
                    _templateVCounts[b.Template] = _templateVCounts.GetValueOrDefault(b.Template) + 1;
                }
            }
        }

        DominantTemplate = normal.Count == 0 ? (short)-1 : normal.MaxBy(kv => kv.Value).Key;

        RrS = new float[Count];
        var analysable = Analysable(stretches);
        var cursor = 0;
        var previous = -1;
        for (var i = 0; i < Count; i++)
        {
            var t = TimeS(i);
            while (cursor < analysable.Count && analysable[cursor].EndS <= t)
            {
                cursor++;
            }

            var inside = cursor < analysable.Count && analysable[cursor].StartS <= t ? cursor : -1;
            RrS[i] = float.NaN;
            if (i > 0 && inside >= 0 && inside == previous)
            {
                var rr = t - TimeS(i - 1);
                if (rr > 0 && rr <= maxBeatGapS)
                {
                    RrS[i] = (float)rr;
                }
            }

            previous = inside;
        }
    }

    public int Count { get; }

    public double RateHz { get; }

    /// <summary>RR ending at beat i, seconds; NaN when not analysable.</summary>
    public float[] RrS { get; }

    public ref readonly Beat this[int i] => ref _beats[_offset + i];

    public double TimeS(int i) => _beats[_offset + i].Sample / RateHz;

    /// <summary>The morphology template holding most of the recording's N beats (its usual conducted QRS), or −1.</summary>
    public short DominantTemplate { get; }

    /// <summary>Beats of the recording in the morphology template of beat i (0 when it has none).</summary>
    public int TemplateCount(int i) => _templateCounts.GetValueOrDefault(this[i].Template);

    /// <summary>
    /// Beat <paramref name="i"/> is labelled V, or has the shape of a template whose beats (at least three) are mostly
    /// labelled V: a ventricular shape even where its own label says otherwise.
    /// </summary>
    public bool VentricularShape(int i)
    {
        ref readonly var b = ref this[i];
        if (b.Class == BeatClass.V)
        {
            return true;
        }

        var total = b.Template >= 0 ? _templateCounts.GetValueOrDefault(b.Template) : 0;
        return total >= 3 && 2 * _templateVCounts.GetValueOrDefault(b.Template) > total;
    }

    public bool HasRr(int i) => i > 0 && i < Count && !float.IsNaN(RrS[i]);

    /// <summary>First beat at or after <paramref name="tS"/> (Count when none).</summary>
    public int FirstAtOrAfter(double tS)
    {
        int lo = 0, hi = Count;
        var sample = tS * RateHz;
        while (lo < hi)
        {
            var mid = (lo + hi) >>> 1;
            if (_beats[_offset + mid].Sample < sample - 1e-6)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }

        return lo;
    }

    /// <summary>Last beat at or before <paramref name="tS"/> (−1 when none).</summary>
    public int LastAtOrBefore(double tS)
    {
        var i = FirstAtOrAfter(tS);
        if (i < Count && Math.Abs(_beats[_offset + i].Sample - tS * RateHz) <= 1e-6)
        {
            return i;
        }

        return i - 1;
    }

    /// <summary>Mean rate over beats first … last (intervals between them), bpm; NaN when none analysable.</summary>
    public double MeanBpm(int first, int last)
    {
        double sum = 0;
        var n = 0;
        for (var i = first + 1; i <= last; i++)
        {
            if (HasRr(i))
            {
                sum += RrS[i];
                n++;
            }
        }

        return n > 0 ? 60.0 * n / sum : double.NaN;
    }

    /// <summary>Highest and lowest rate over sliding means of <paramref name="window"/> RR inside first … last (all when fewer), bpm.</summary>
    public (double Max, double Min) Extremes(int first, int last, int window)
    {
        var rr = new List<double>();
        for (var i = first + 1; i <= last; i++)
        {
            if (HasRr(i))
            {
                rr.Add(RrS[i]);
            }
        }

        if (rr.Count == 0)
        {
            return (double.NaN, double.NaN);
        }

        var w = Math.Min(window, rr.Count);
        double sum = 0, max = double.MinValue, min = double.MaxValue;
        for (var i = 0; i < rr.Count; i++)
        {
            sum += rr[i];
            if (i >= w)
            {
                sum -= rr[i - w];
            }

            if (i >= w - 1)
            {
                var bpm = 60.0 * w / sum;
                max = Math.Max(max, bpm);
                min = Math.Min(min, bpm);
            }
        }

        return (max, min);
    }

    private static List<SignalStretch> Analysable(IReadOnlyList<SignalStretch> stretches)
    {
        var list = new List<SignalStretch>();
        if (stretches.Count == 0)
        {
            list.Add(new SignalStretch(double.NegativeInfinity, double.PositiveInfinity, true));
            return list;
        }

        foreach (var s in stretches.Where(s => s.Analysable && s.EndS > s.StartS).OrderBy(s => s.StartS))
        {
            if (list.Count > 0 && s.StartS <= list[^1].EndS)
            {
                list[^1] = list[^1] with { EndS = Math.Max(list[^1].EndS, s.EndS) };
            }
            else
            {
                list.Add(s);
            }
        }

        return list;
    }
}
