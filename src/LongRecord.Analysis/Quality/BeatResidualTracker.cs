using System.Numerics;

namespace LongRecord.Analysis.Quality;

/// <summary>
/// Noise outside the QRS complexes, beat by beat, for one lead. Complexes are located without the detector: a 100 ms
/// block whose QRS-band slope peak reaches 0.4 of the lead's slope reference and is the largest within ±200 ms marks
/// one, at the sample of that peak. Each complex's surroundings (200 ms before to 400 ms after, QRS itself −60…+80 ms
/// left out, both with their means removed) are compared with those of the previous three complexes; the smallest
/// mean absolute difference is the beat's residual; the comparison with the next complex also counts for the previous
/// one, so the first beat of a new morphology (the onset of a run) finds its like. Noise appears twice in the
/// difference; P and T waves, which repeat, cancel; an isolated ectopic beat still finds a normal neighbour for the
/// beat after it. The segments are sampled every few samples (about 120 per second): the residual is a mean, and
/// P and T waves are slow. Values are common practice, no source.
/// </summary>
internal sealed class BeatResidualTracker
{
    private const int Compared = 3;
    private const int PendingCapacity = 16;
    private const int ResultCapacity = 32;
    private const float CandidateFraction = 0.4f;
    private const double ShortRrFraction = 0.6;

    private readonly int _before;
    private readonly int _qrsBefore;
    private readonly int _qrsAfter;
    private readonly int _after;
    private readonly int _stride;
    private readonly int _points;
    private readonly float[][] _segments = new float[Compared][];
    private readonly long[] _segmentR = new long[Compared];
    private readonly long[] _pending = new long[PendingCapacity];
    private readonly long[] _resultR = new long[ResultCapacity];
    private readonly float[] _result = new float[ResultCapacity];
    private readonly float[] _current;
    private readonly float[] _raw;
    private int _segmentCount;
    private int _segmentNext;
    private int _pendingHead;
    private int _pendingCount;
    private int _resultNext;
    private int _resultCount;

    public BeatResidualTracker(double samplingRateHz)
    {
        _before = (int)Math.Round(0.2 * samplingRateHz);
        _qrsBefore = (int)Math.Round(0.06 * samplingRateHz);
        _qrsAfter = (int)Math.Round(0.08 * samplingRateHz);
        _after = (int)Math.Round(0.4 * samplingRateHz);
        _stride = Math.Max(1, (int)(samplingRateHz / 120));
        _points = (_before + _after + _stride - 1) / _stride;
        for (var i = 0; i < Compared; i++)
        {
            _segments[i] = new float[_points];
        }

        _current = new float[_points];
        _raw = new float[_before + _after];
    }

    /// <summary>Call after every closed block; <paramref name="closedBlocks"/> blocks are closed so far.</summary>
    public void OnBlockClosed(LeadSignalBlocks blocks, long closedBlocks, float slopeReference)
    {
        var j = closedBlocks - 3;
        if (j >= 0 && slopeReference > 0 && IsComplex(blocks, j, closedBlocks, slopeReference * CandidateFraction) && _pendingCount < PendingCapacity)
        {
            _pending[(_pendingHead + _pendingCount) % PendingCapacity] = blocks.Block(j).SlopePeakSample;
            _pendingCount++;
        }

        while (_pendingCount > 0 && _pending[_pendingHead] + _after <= blocks.Written)
        {
            Measure(blocks, _pending[_pendingHead]);
            _pendingHead = (_pendingHead + 1) % PendingCapacity;
            _pendingCount--;
        }
    }

    /// <summary>Complexes located at samples [from, to) among those already measured.</summary>
    public int CountComplexes(long fromSample, long toSample)
    {
        var n = 0;
        for (var i = 0; i < _resultCount; i++)
        {
            n += _resultR[i] >= fromSample && _resultR[i] < toSample ? 1 : 0;
        }

        return n;
    }

    /// <summary>Median residual (mV) of the beats at samples [from, to), or NaN when there are none.</summary>
    public float MedianResidual(long fromSample, long toSample)
    {
        Span<float> values = stackalloc float[ResultCapacity];
        var n = 0;
        for (var i = 0; i < _resultCount; i++)
        {
            var r = _resultR[i];
            if (r >= fromSample && r < toSample && !float.IsNaN(_result[i]))
            {
                values[n++] = _result[i];
            }
        }

        if (n == 0)
        {
            return float.NaN;
        }

        values = values[..n];
        values.Sort();
        return values[n / 2];
    }

    private static bool IsComplex(LeadSignalBlocks blocks, long j, long closed, float threshold)
    {
        var peak = blocks.Block(j).SlopePeak;
        if (peak < threshold)
        {
            return false;
        }

        for (var q = Math.Max(0, j - 2); q <= j + 2 && q < closed; q++)
        {
            var other = blocks.Block(q).SlopePeak;
            if (q != j && (other > peak || (other == peak && q < j)))
            {
                return false;
            }
        }

        return true;
    }

    private void Measure(LeadSignalBlocks blocks, long r)
    {
        if (r - _before < 0)
        {
            return;
        }

        blocks.CopyRange(r - _before, r + _after, _raw);
        for (int i = 0, j = 0; i < _raw.Length; i += _stride, j++)
        {
            var v = _raw[i];
            if (float.IsNaN(v))
            {
                return;
            }

            _current[j] = v;
        }

        var best = float.NaN;
        var newest = (_segmentNext + Compared - 1) % Compared;
        for (var i = 0; i < _segmentCount; i++)
        {
            var rr = r - _segmentR[i];
            var end = (int)Math.Min(_after, ShortRrFraction * rr);
            var d = Difference(_current, _segments[i], end);
            if (float.IsNaN(d))
            {
                continue;
            }

            best = d >= best ? best : d;
            if (i == newest && _resultCount > 0 && _resultR[LastResult] == _segmentR[i])
            {
                var previous = _result[LastResult];
                _result[LastResult] = d >= previous ? previous : d;
            }
        }

        _current.CopyTo(_segments[_segmentNext], 0);
        _segmentR[_segmentNext] = r;
        _segmentNext = (_segmentNext + 1) % Compared;
        _segmentCount = Math.Min(_segmentCount + 1, Compared);
        // Stored even when NaN (the first beat): the next beat may still give it a value.
        _result[_resultNext] = best;
        _resultR[_resultNext] = r;
        _resultNext = (_resultNext + 1) % ResultCapacity;
        _resultCount = Math.Min(_resultCount + 1, ResultCapacity);
    }

    private int LastResult => (_resultNext + ResultCapacity - 1) % ResultCapacity;

    // Mean absolute difference of the two segments outside the QRS, each with its own mean removed; point p of a
    // segment lies p × stride samples after 'before' samples ahead of its R.
    private float Difference(float[] a, float[] b, int endAfterR)
    {
        var stop = Math.Min(_points, (_before + endAfterR + _stride - 1) / _stride);
        var qrsFrom = Math.Min(stop, (_before - _qrsBefore + _stride - 1) / _stride);
        var qrsTo = Math.Min(stop, (_before + _qrsAfter + _stride - 1) / _stride);
        var n = qrsFrom + (stop - qrsTo);
        if (n <= 0)
        {
            return float.NaN;
        }

        var offset = (SumDifference(a, b, 0, qrsFrom) + SumDifference(a, b, qrsTo, stop)) / n;
        return (SumAbsDeviation(a, b, 0, qrsFrom, offset) + SumAbsDeviation(a, b, qrsTo, stop, offset)) / n;
    }

    // Sums eight points at a time (the lanes added at the end): the segments' sums were chains of dependent additions.
    private static float SumDifference(float[] a, float[] b, int from, int to)
    {
        var t = from;
        var acc = Vector<float>.Zero;
        for (; t + Vector<float>.Count <= to; t += Vector<float>.Count)
        {
            acc += new Vector<float>(a, t) - new Vector<float>(b, t);
        }

        var sum = Vector.Sum(acc);
        for (; t < to; t++)
        {
            sum += a[t] - b[t];
        }

        return sum;
    }

    private static float SumAbsDeviation(float[] a, float[] b, int from, int to, float offset)
    {
        var t = from;
        var acc = Vector<float>.Zero;
        var offsets = new Vector<float>(offset);
        for (; t + Vector<float>.Count <= to; t += Vector<float>.Count)
        {
            acc += Vector.Abs(new Vector<float>(a, t) - new Vector<float>(b, t) - offsets);
        }

        var sum = Vector.Sum(acc);
        for (; t < to; t++)
        {
            sum += Math.Abs(a[t] - b[t] - offset);
        }

        return sum;
    }
}
