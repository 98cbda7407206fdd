using System.Numerics;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;
using LongRecord.Analysis.Numerics;

namespace LongRecord.Analysis.Quality;

/// <summary>
/// The per-sample part of the monitor for one lead: folds raw and conditioned samples into 100 ms
/// <see cref="SignalBlock"/>s and keeps the last few seconds of the conditioned signal (for the block statistics,
/// the beat residual and the narrow-band measure). Raw statistics are gathered sample by sample; the conditioned ones
/// when a block closes, over the block's own samples in a fixed order. All state is carried between calls, so any
/// block size gives the same blocks.
/// </summary>
internal sealed class LeadSignalBlocks
{
    /// <summary>Blocks kept (a power of two).</summary>
    public const int BlockRing = 32;

    private readonly int _lag;
    private readonly int _stuckRun;
    private readonly int _plateauRun;
    private readonly float _railLow;
    private readonly float _railHigh;
    private readonly float _tolerance;
    private readonly float[] _ring;
    private readonly float[] _scratch;
    private readonly SignalBlock[] _blocks = new SignalBlock[BlockRing];
    private int _ringPos;
    private long _written;
    private long _blockStart;
    private float _previous = float.NaN;
    private int _run;
    private static readonly SignalBlock s_empty = SignalBlock.Empty;
    private SignalBlock _current = s_empty;

    public LeadSignalBlocks(double samplingRateHz, double railLowMv, double railHighMv, QualitySettings settings)
    {
        // 16 ms difference: gain 2|sin(π f 0.016)|, largest at 31 Hz, 0.5 at 5 Hz, 0.1 at 1 Hz — the QRS band
        // without the T wave (common practice, no source).
        _lag = Math.Max(1, (int)Math.Round(0.016 * samplingRateHz));
        _stuckRun = Math.Max(3, (int)Math.Round(settings.StuckMinS * samplingRateHz));
        _plateauRun = Math.Max(3, (int)Math.Round(settings.ClipPlateauMinS * samplingRateHz));
        _tolerance = (float)settings.RailToleranceMv;
        // Unknown rails become unreachable values. A sample beyond a rail by more than the tolerance proves the rail
        // was not the recorder's limit (NSTDB's headers declare 11-bit rails that its noise-added samples exceed).
        _railLow = double.IsNaN(railLowMv) ? float.NegativeInfinity : (float)railLowMv;
        _railHigh = double.IsNaN(railHighMv) ? float.PositiveInfinity : (float)railHighMv;
        _ring = new float[(int)Math.Ceiling(2.6 * samplingRateHz) + _lag];
        Array.Fill(_ring, float.NaN);
        _scratch = new float[(int)Math.Ceiling(samplingRateHz / 10) + 1 + _lag];
    }

    public int RingLength => _ring.Length;

    /// <summary>Samples folded so far.</summary>
    public long Written => _written;

    /// <summary>Folds samples that all belong to the current block.</summary>
    public void Add(ReadOnlySpan<float> raw, ReadOnlySpan<float> cond)
    {
        if (cond.Length < raw.Length)
        {
            throw new ArgumentException("the conditioned span is shorter than the raw one", nameof(cond));
        }

        var n = raw.Length;
        StoreInRing(cond[..n]);
        ref var b = ref _current;
        var missing = SpanStatistics.HasNaN(raw) || !TryShortRuns(raw) ? TrackRuns(raw, ref b) : 0;
        if (missing == 0)
        {
            var (min, max) = SpanStatistics.MinMax(raw);
            b.RawMin = Math.Min(b.RawMin, min);
            b.RawMax = Math.Max(b.RawMax, max);
        }
        else
        {
            foreach (var x in raw)
            {
                if (!float.IsNaN(x))
                {
                    b.RawMin = Math.Min(b.RawMin, x);
                    b.RawMax = Math.Max(b.RawMax, x);
                }
            }
        }

        b.Valid += n - missing;
        b.Missing += missing;
        _written += n;
    }

    // The raw statistics that need the sample order (runs of equal samples), a compare and a select per sample, for a
    // block with a gap or a run long enough to be a plateau; returns the missing samples.
    private int TrackRuns(ReadOnlySpan<float> raw, ref SignalBlock b)
    {
        var n = raw.Length;
        var stuckRun = _stuckRun;
        var plateauRun = _plateauRun;
        var previous = _previous;
        var run = _run;
        var missing = 0;
        for (var i = 0; i < n; i++)
        {
            var x = raw[i];
            if (float.IsNaN(x))
            {
                MarkMissing(n - i);
                missing++;
                previous = float.NaN;
                run = 0;
                continue;
            }

            run = x == previous ? run + 1 : 1;
            previous = x;
            if (run >= plateauRun)
            {
                LongRun(ref b, x, run >= stuckRun);
            }
        }

        _previous = previous;
        _run = run;
        return missing;
    }

    // The usual block: no gap and no run of equal samples as long as a clipping plateau (runs of equal samples are
    // common at 360 Hz and 5 µV steps, long ones are rare). The runs are read from a bit mask of "equal to the sample
    // before", 64 samples at a time; the carried run and the last sample are updated as the per-sample loop would
    // update them. False, with nothing changed, when some sample would reach a plateau: the caller then tracks the runs
    // sample by sample.
    private bool TryShortRuns(ReadOnlySpan<float> raw)
    {
        var run = _run;
        var previous = _previous;
        var plateau = _plateauRun;
        for (var start = 0; start < raw.Length; start += 64)
        {
            var piece = raw.Slice(start, Math.Min(64, raw.Length - start));
            var n = piece.Length;
            var mask = EqualToPrevious(piece, previous);
            var leading = BitOperations.TrailingZeroCount(~mask);
            leading = Math.Min(leading, n);
            if (leading > 0 && run + leading >= plateau)
            {
                return false; // the run carried in reaches a plateau
            }

            // P − 1 equal pairs in a row inside the piece: a run of P samples.
            var ones = mask;
            for (var shift = 1; shift < plateau - 1 && ones != 0; shift++)
            {
                ones &= mask >> shift;
            }

            if (ones != 0 && plateau - 1 <= n)
            {
                return false;
            }

            if (leading == n)
            {
                run += n;
            }
            else
            {
                // The run at the piece's end: the equal pairs that end it, plus its first sample.
                var top = mask << (64 - n);
                run = BitOperations.LeadingZeroCount(~top) + 1;
            }

            previous = piece[n - 1];
        }

        _run = run;
        _previous = previous;
        return true;
    }

    // Bit i set where piece[i] equals the sample before it (for i = 0, previous); at most 64 samples, none NaN.
    private static ulong EqualToPrevious(ReadOnlySpan<float> piece, float previous)
    {
        var n = piece.Length;
        ulong mask = piece[0] == previous ? 1UL : 0UL;
        var i = 1;
        if (Vector256.IsHardwareAccelerated)
        {
            ref var first = ref MemoryMarshal.GetReference(piece);
            for (; i + 8 <= n; i += 8)
            {
                var here = Vector256.LoadUnsafe(ref first, (nuint)i);
                var before = Vector256.LoadUnsafe(ref first, (nuint)(i - 1));
                mask |= (ulong)Vector256.Equals(here, before).ExtractMostSignificantBits() << i;
            }
        }

        for (; i < n; i++)
        {
            mask |= (piece[i] == piece[i - 1] ? 1UL : 0UL) << i;
        }

        return mask;
    }

    // A sample inside a run of equal samples at least a clipping plateau long. Saturation needs such a run: a recorder
    // on its rail holds the value, while a signal that only passes the rail does not.
    private void LongRun(ref SignalBlock b, float x, bool stuck)
    {
        b.Plateau++;
        b.PlateauMin = Math.Min(b.PlateauMin, x);
        b.PlateauMax = Math.Max(b.PlateauMax, x);
        b.Stuck += stuck ? 1 : 0;
        b.Railed += Math.Abs(x - _railHigh) <= _tolerance || Math.Abs(x - _railLow) <= _tolerance ? 1 : 0;
    }

    /// <summary>Stores the current block as block <paramref name="blockIndex"/> and starts the next.</summary>
    public void Close(long blockIndex)
    {
        ConditionedStatistics(ref _current);
        _blocks[(int)(blockIndex & (BlockRing - 1))] = _current;
        _current = s_empty;
        _blockStart = _written;
    }

    public ref readonly SignalBlock Block(long blockIndex) => ref _blocks[(int)(blockIndex & (BlockRing - 1))];

    /// <summary>
    /// Copies conditioned samples <paramref name="startSample"/> … <paramref name="endSample"/> − 1 into
    /// <paramref name="destination"/>; they must be among the last <see cref="RingLength"/> written. Samples before the
    /// first one read as NaN.
    /// </summary>
    public void CopyRange(long startSample, long endSample, Span<float> destination)
    {
        var count = (int)(endSample - startSample);
        if (_written - startSample > _ring.Length + Math.Max(0, -startSample) || endSample > _written || count < 0)
        {
            throw new InvalidOperationException($"samples {startSample}…{endSample} are no longer held ({_written} written, ring of {_ring.Length})");
        }

        if (startSample < 0)
        {
            var before = (int)Math.Min(count, -startSample);
            destination[..before].Fill(float.NaN);
            destination = destination[before..];
            startSample += before;
            count -= before;
        }

        var at = _ringPos - (int)(_written - startSample);
        if (at < 0)
        {
            at += _ring.Length;
        }

        var first = Math.Min(count, _ring.Length - at);
        _ring.AsSpan(at, first).CopyTo(destination);
        _ring.AsSpan(0, count - first).CopyTo(destination[first..]);
    }

    // The last samples startSample … _written − 1 read in place where the ring holds them in one piece, else copied
    // into scratch (as CopyRange).
    private ReadOnlySpan<float> Held(long startSample, long endSample, float[] scratch)
    {
        var at = _ringPos - (int)(_written - startSample);
        var count = (int)(endSample - startSample);
        if (startSample >= 0 && at >= 0 && endSample == _written)
        {
            return _ring.AsSpan(at, count);
        }

        var copy = scratch.AsSpan(0, count);
        CopyRange(startSample, endSample, copy);
        return copy;
    }

    private void StoreInRing(ReadOnlySpan<float> cond)
    {
        var first = Math.Min(cond.Length, _ring.Length - _ringPos);
        cond[..first].CopyTo(_ring.AsSpan(_ringPos));
        cond[first..].CopyTo(_ring);
        var pos = _ringPos + cond.Length;
        _ringPos = pos >= _ring.Length ? pos - _ring.Length : pos;
    }

    // A missing raw sample enters the ring as NaN; it lies `back` samples behind the ring position.
    private void MarkMissing(int back)
    {
        var at = _ringPos - back;
        _ring[at < 0 ? at + _ring.Length : at] = float.NaN;
    }

    // Sum, extremes and QRS-band slope peak of the block's conditioned samples, over the block's own samples in a fixed
    // order: the same whatever pieces the input came in.
    private void ConditionedStatistics(ref SignalBlock b)
    {
        var count = (int)(_written - _blockStart);
        var lag = _lag;
        var span = Held(_blockStart - lag, _written, _scratch);
        var block = span[lag..];
        var (nan, sum, min, max, peak, at) = SpanStatistics.Block(span, lag);
        if (!nan)
        {
            b.CondSum = sum;
            b.CondCount = count;
            b.CondMin = min;
            b.CondMax = max;
            b.SlopePeak = peak;
            b.SlopePeakSample = _blockStart + at;
            return;
        }

        double total = 0;
        for (var i = 0; i < count; i++)
        {
            var y = block[i];
            if (float.IsNaN(y))
            {
                continue;
            }

            total += y;
            b.CondCount++;
            b.CondMin = Math.Min(b.CondMin, y);
            b.CondMax = Math.Max(b.CondMax, y);
            // NaN before the lag is filled (start, gaps) fails the comparison and is ignored.
            var slope = Math.Abs(y - span[i]);
            if (slope > b.SlopePeak)
            {
                b.SlopePeak = slope;
                b.SlopePeakSample = _blockStart + i;
            }
        }

        b.CondSum = total;
    }
}
