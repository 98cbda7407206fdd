namespace LongRecord.Analysis.Quality;

/// <summary>
/// The per-sample part of the monitor for one lead: folds raw and conditioned samples into 100 ms
/// <see cref="SignalBlock"/>s and keeps the last few seconds of the conditioned signal for the narrow-band measure.
/// All state is carried between calls, so any block size gives the same blocks.
/// </summary>
internal sealed class LeadSignalBlocks
{
    public const int BlockRing = 32;

    private readonly int _lag;
    private readonly int _stuckRun;
    private readonly int _plateauRun;
    private readonly float _railLow;
    private readonly float _railHigh;
    private readonly float _tolerance;
    private readonly float[] _ring;
    private readonly SignalBlock[] _blocks = new SignalBlock[BlockRing];
    private int _ringPos;
    private long _written;
    private float _previous = float.NaN;
    private int _run;
    private SignalBlock _current = SignalBlock.Empty;

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

        // The hot loop of the monitor: everything lives in locals, and the usual paths are free of unpredictable
        // branches (runs of equal samples are common at 360 Hz and 5 µV steps).
        var ring = _ring;
        var len = ring.Length;
        var pos = _ringPos;
        var lag = _lag;
        var stuckRun = _stuckRun;
        var plateauRun = _plateauRun;
        var railLow = _railLow;
        var railHigh = _railHigh;
        var tolerance = _tolerance;
        var previous = _previous;
        var run = _run;
        ref var b = ref _current;
        int valid = b.Valid, missing = b.Missing, railed = b.Railed, condCount = b.CondCount;
        float rawMin = b.RawMin, rawMax = b.RawMax, condMin = b.CondMin, condMax = b.CondMax, peak = b.SlopePeak;
        var condSum = b.CondSum;
        var peakAt = -1;
        for (var i = 0; i < raw.Length; i++)
        {
            var x = raw[i];
            var y = cond[i];
            var back = pos - lag;
            back += (back >> 31) & len;
            var before = ring[back];
            // x − x is NaN for a missing sample and 0 otherwise: missing samples enter the ring as NaN.
            ring[pos] = y + (x - x);
            pos = pos + 1 == len ? 0 : pos + 1;
            if (float.IsNaN(x))
            {
                missing++;
                previous = float.NaN;
                run = 0;
                continue;
            }

            valid++;
            var same = x == previous;
            run = same ? run + 1 : 1;
            previous = x;
            var atRail = Math.Abs(x - railHigh) <= tolerance | Math.Abs(x - railLow) <= tolerance;
            railed += same & atRail ? 1 : 0;
            if (run >= plateauRun)
            {
                b.Plateau++;
                b.PlateauMin = Math.Min(b.PlateauMin, x);
                b.PlateauMax = Math.Max(b.PlateauMax, x);
                b.Stuck += run >= stuckRun ? 1 : 0;
            }

            rawMin = x < rawMin ? x : rawMin;
            rawMax = x > rawMax ? x : rawMax;
            if (!float.IsNaN(y))
            {
                condSum += y;
                condCount++;
                condMin = y < condMin ? y : condMin;
                condMax = y > condMax ? y : condMax;
                // NaN before the lag is filled (start, gaps) fails the comparison and is ignored.
                var slope = Math.Abs(y - before);
                if (slope > peak)
                {
                    peak = slope;
                    peakAt = i;
                }
            }
        }

        b.Valid = valid;
        b.Missing = missing;
        b.Railed = railed;
        b.CondCount = condCount;
        b.RawMin = rawMin;
        b.RawMax = rawMax;
        b.CondMin = condMin;
        b.CondMax = condMax;
        b.CondSum = condSum;
        if (peakAt >= 0)
        {
            b.SlopePeak = peak;
            b.SlopePeakSample = _written + peakAt;
        }

        _ringPos = pos;
        _written += raw.Length;
        _previous = previous;
        _run = run;
    }

    /// <summary>Stores the current block as block <paramref name="blockIndex"/> and starts the next.</summary>
    public void Close(long blockIndex)
    {
        _blocks[blockIndex % BlockRing] = _current;
        _current = SignalBlock.Empty;
    }

    public ref readonly SignalBlock Block(long blockIndex) => ref _blocks[blockIndex % BlockRing];

    /// <summary>
    /// Copies conditioned samples <paramref name="startSample"/> … <paramref name="endSample"/> − 1 into
    /// <paramref name="destination"/>; they must be among the last <see cref="RingLength"/> written.
    /// </summary>
    public void CopyRange(long startSample, long endSample, Span<float> destination)
    {
        var count = (int)(endSample - startSample);
        if (_written - startSample > _ring.Length || endSample > _written || count < 0)
        {
            throw new InvalidOperationException($"samples {startSample}…{endSample} are no longer held ({_written} written, ring of {_ring.Length})");
        }

        var at = _ringPos - (int)(_written - startSample);
        if (at < 0)
        {
            at += _ring.Length;
        }

        for (var i = 0; i < count; i++)
        {
            destination[i] = _ring[at];
            at = at + 1 == _ring.Length ? 0 : at + 1;
        }
    }
}
