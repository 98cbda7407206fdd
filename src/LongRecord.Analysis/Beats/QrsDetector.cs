using System.Numerics;
using LongRecord.Analysis.Conditioning;

namespace LongRecord.Analysis.Beats;

/// <summary>
/// Multi-lead QRS detector after Pan J, Tompkins WJ. "A real-time QRS detection algorithm."
/// IEEE Trans Biomed Eng 32(3):230–236, 1985: band-pass filter, derivative, squaring, moving-window integration,
/// then fiducial marks on the integrated signal judged against adaptive thresholds, with search-back for missed beats,
/// a refractory period and T-wave discrimination. Beyond the paper: every lead runs the front end; each lead's
/// integrated signal is scaled by that lead's own QRS level, compressed (power 0.75) and weighted by the lead's
/// quality before fusion, so a beat clear in one lead is found when another lead is noisy; levels are medians of the
/// last eight peaks (Hamilton &amp; Tompkins 1986 found medians more robust than running means).
/// </summary>
public sealed partial class QrsDetector
{
    private const int History = 8;

    // Samples of history the five-point derivative needs.
    private const int DerivativeOrder = 4;

    // Fused values are computed a few samples ahead with the leads' current levels; a beat changes the levels, and
    // the values after it are computed again (our choice: short enough that little is recomputed).
    private const int FuseBatch = 32;

    private readonly double _fs;
    private readonly int _leads;
    private readonly int _window;
    private readonly int _refractory;
    private readonly int _tWaveLimit;
    private readonly int _peakHalfWidth;
    private readonly int _delay;
    private readonly int _learnSamples;
    private readonly int _ring;
    private readonly int _chunk;

    private readonly BiquadCascade[] _bandPass;
    private readonly float[] _held;
    private readonly bool[] _settled;
    private readonly bool[] _settlePending;
    private readonly float[][] _derivativeHistory;
    private readonly float[][] _squares;
    private readonly double[] _integralSum;
    private readonly float[] _chunkSlopes;
    private readonly double[] _chunkSums;
    private readonly float[] _chunkIntegrated;
    private readonly float[][] _slope;
    private readonly float[][] _integrated;
    private readonly float[] _fused;
    private readonly float[] _fuseSums = new float[FuseBatch];

    private readonly double[] _leadLevel;
    private readonly double[] _leadNoise;
    private readonly double[] _leadWeight;

    private readonly double[] _qrsPeaks = new double[History];
    private readonly double[] _noisePeaks = new double[History];
    private readonly double[] _rr = new double[History];
    private int _qrsPeakCount;
    private int _noisePeakCount;
    private int _rrCount;

    private readonly List<Candidate> _sinceLast = new();
    private readonly List<long> _output = new();
    private float[] _scratch = [];

    private long _n;
    private int _slot;
    private bool _learned;
    private long _fusedUntil;
    private double _spk;
    private double _npk;
    private double _rrAverage;
    private long _lastEmitted = -1;

    // The last QRS mark (final or still open to a larger mark within the refractory period), and the first sample at
    // which search-back is due for it: 1.66 average RR after it.
    private Candidate _last;
    private bool _hasLast;
    private bool _lastFinal = true;
    private long _searchBackDue = long.MaxValue;

    public QrsDetector(double samplingRateHz, int leads)
    {
        _fs = samplingRateHz;
        _leads = leads;
        _window = Math.Max(1, Ms(IntegrationWindowMs));
        _refractory = Ms(200);
        _tWaveLimit = Ms(360);
        _peakHalfWidth = Math.Max(1, Ms(80));
        _delay = Ms(35);
        _learnSamples = Ms(2000);
        _ring = Ms(8000);
        _chunk = Math.Max(1, Ms(1000));
        _bandPass = new BiquadCascade[leads];
        _held = new float[leads];
        _settled = new bool[leads];
        _settlePending = new bool[leads];
        _derivativeHistory = new float[leads][];
        _squares = new float[leads][];
        _integralSum = new double[leads];
        _chunkSlopes = new float[_chunk];
        _chunkSums = new double[_chunk];
        _chunkIntegrated = new float[_chunk];
        _slope = new float[leads][];
        _integrated = new float[leads][];
        _fused = new float[_ring];
        _leadLevel = new double[leads];
        _leadNoise = new double[leads];
        _leadWeight = new double[leads];
        for (var k = 0; k < leads; k++)
        {
            _bandPass[k] = new BiquadCascade(new NWaves.Filters.Butterworth.BandPassFilter(BandLowHz / _fs, BandHighHz / _fs, 2).Tf);
            _derivativeHistory[k] = new float[DerivativeOrder + _chunk];
            _squares[k] = new float[_window + _chunk];
            _slope[k] = new float[_ring];
            _integrated[k] = new float[_ring];
            _leadWeight[k] = 1;
        }

        _rrAverage = _fs;
    }

    /// <summary>Detections not yet taken, in time order (fiducial sample indices).</summary>
    public IReadOnlyList<long> Detections => _output;

    /// <summary>Moves the detections made so far into <paramref name="into"/> (in time order) and forgets them.</summary>
    public void TakeDetections(List<long> into)
    {
        into.AddRange(_output);
        _output.Clear();
    }

    /// <summary>Samples fed so far.</summary>
    public long SamplesProcessed => _n;

    /// <summary>Feeds <paramref name="count"/> samples of every lead, lead-major (lead k at k × count).</summary>
    public void Process(ReadOnlySpan<float> block, int count)
    {
        var bp = Scratch(_leads * count);
        block[..bp.Length].CopyTo(bp);
        for (var k = 0; k < _leads; k++)
        {
            HoldThroughGaps(k, bp.Slice(k * count, count));
        }

        BandPass(bp, count);

        // The front end runs lead by lead over chunks of at most one second (tight loops); the decisions then run
        // sample by sample, reading the rings no further back than they hold.
        for (var done = 0; done < count;)
        {
            var chunk = Math.Min(count - done, _chunk);
            for (var k = 0; k < _leads; k++)
            {
                FrontEnd(k, bp.Slice(k * count + done, chunk));
            }

            Decide(chunk);
            done += chunk;
        }
    }

    /// <summary>Ends the stream: the last pending beat becomes final.</summary>
    public void Flush()
    {
        FinaliseLast();
    }

    private int Ms(double ms) => (int)Math.Round(ms * 0.001 * _fs);

    private Span<float> Scratch(int length)
    {
        if (_scratch.Length < length)
        {
            _scratch = new float[length];
        }

        return _scratch.AsSpan(0, length);
    }

    private int Next(int slot) => slot + 1 == _ring ? 0 : slot + 1;

    private int SlotOf(long t) => (int)(t % _ring);

    // Missing samples (NaN, and any non-finite value) take the lead's last valid value, from its first valid one on,
    // as the conditioner holds them through its filters: one NaN would otherwise stay in the band-pass state and the
    // running sum for the rest of the recording, and every later sample would pass as a fiducial mark. The quality
    // monitor marks such stretches unanalysable; the detector only has to come through them.
    private void HoldThroughGaps(int k, Span<float> lead)
    {
        if (lead.IsEmpty)
        {
            return;
        }

        if (!_settled[k] && FirstFinite(lead) is float first)
        {
            // The lead's first valid sample, in whichever block it comes: the band-pass settles on it (BandPass).
            _held[k] = first;
            _settlePending[k] = true;
            _settled[k] = true;
        }

        if (AllFinite(lead))
        {
            _held[k] = lead[^1];
            return;
        }

        var held = _held[k];
        for (var i = 0; i < lead.Length; i++)
        {
            if (float.IsFinite(lead[i]))
            {
                held = lead[i];
            }
            else
            {
                lead[i] = held;
            }
        }

        _held[k] = held;
    }

    private static float? FirstFinite(ReadOnlySpan<float> x)
    {
        foreach (var v in x)
        {
            if (float.IsFinite(v))
            {
                return v;
            }
        }

        return null;
    }

    private static bool AllFinite(ReadOnlySpan<float> x)
    {
        var i = 0;
        if (Vector.IsHardwareAccelerated)
        {
            // x − x is 0 for a finite value, NaN for NaN and ±∞.
            for (; i + Vector<float>.Count <= x.Length; i += Vector<float>.Count)
            {
                var v = new Vector<float>(x[i..]);
                if (!Vector.EqualsAll(v - v, Vector<float>.Zero))
                {
                    return false;
                }
            }
        }

        for (; i < x.Length; i++)
        {
            if (!float.IsFinite(x[i]))
            {
                return false;
            }
        }

        return true;
    }

    // Band-pass of the paper, several leads at a time in the lanes of one vector (the same arithmetic as lead by lead).
    private void BandPass(Span<float> leads, int count)
    {
        // A lead settles at its first valid sample (held back to the block's start); before it, a lead of nothing but
        // gaps feeds zeros to a filter at rest, so where the caller's blocks begin never matters.
        for (var k = 0; k < _leads && count > 0; k++)
        {
            if (_settlePending[k])
            {
                _bandPass[k].SettleAt(leads[k * count]);
                _settlePending[k] = false;
            }
        }

        BiquadCascade.ProcessLeads(_bandPass, leads, count);
    }

    // Derivative, squaring and moving-window integration of the paper, for one lead over a chunk whose first sample
    // is sample _n; results go into the rings at the chunk's slots. The derivative and the squares are vector work; the
    // running sum is one chain of additions, kept in the scalar order so that every value is the same.
    private void FrontEnd(int k, ReadOnlySpan<float> x)
    {
        var n = x.Length;
        // The lead's last four band-passed samples, then this chunk's.
        var history = _derivativeHistory[k];
        x.CopyTo(history.AsSpan(DerivativeOrder));
        // The squares of the last window's samples, then this chunk's.
        var squares = _squares[k];
        var window = _window;
        var slopes = _chunkSlopes.AsSpan(0, n);
        Derivative(history.AsSpan(0, DerivativeOrder + n), (float)(_fs / 8.0), slopes, squares.AsSpan(window, n));

        var sums = _chunkSums.AsSpan(0, n);
        var sum = _integralSum[k];
        for (var i = 0; i < n; i++)
        {
            sum += squares[window + i] - squares[i];
            sums[i] = sum;
        }

        _integralSum[k] = sum;
        var integrated = _chunkIntegrated.AsSpan(0, n);
        Integrate(sums, 1.0 / window, integrated);
        ToRing(slopes, _slope[k]);
        ToRing(integrated, _integrated[k]);
        history.AsSpan(n, DerivativeOrder).CopyTo(history);
        squares.AsSpan(n, window).CopyTo(squares);
    }

    // Five-point derivative of the paper, y = (2x[n] + x[n−1] − x[n−3] − 2x[n−4]) / 8 per sample interval, of x[4..]
    // (x[0..4] is history); its magnitude and its square.
    private static void Derivative(ReadOnlySpan<float> x, float scale, Span<float> slopes, Span<float> squares)
    {
        var i = 0;
        if (Vector.IsHardwareAccelerated)
        {
            var width = Vector<float>.Count;
            var scales = new Vector<float>(scale);
            for (; i + width <= slopes.Length; i += width)
            {
                var d = (2 * new Vector<float>(x[(i + 4)..]) + new Vector<float>(x[(i + 3)..]) - new Vector<float>(x[(i + 1)..]) - 2 * new Vector<float>(x[i..])) * scales;
                Vector.Abs(d).CopyTo(slopes[i..]);
                (d * d).CopyTo(squares[i..]);
            }
        }

        for (; i < slopes.Length; i++)
        {
            var d = (2 * x[i + 4] + x[i + 3] - x[i + 1] - 2 * x[i]) * scale;
            slopes[i] = Math.Abs(d);
            squares[i] = d * d;
        }
    }

    // The moving-window integral: the running sum of the window's squares over the window's length, never below 0.
    private static void Integrate(ReadOnlySpan<double> sums, double inverseWindow, Span<float> integrated)
    {
        var i = 0;
        if (Vector.IsHardwareAccelerated)
        {
            var width = Vector<float>.Count;
            var half = width / 2;
            var factor = new Vector<double>(inverseWindow);
            for (; i + width <= sums.Length; i += width)
            {
                var low = Vector.Max(Vector<double>.Zero, new Vector<double>(sums[i..]) * factor);
                var high = Vector.Max(Vector<double>.Zero, new Vector<double>(sums[(i + half)..]) * factor);
                Vector.Narrow(low, high).CopyTo(integrated[i..]);
            }
        }

        for (; i < sums.Length; i++)
        {
            integrated[i] = (float)Math.Max(0, sums[i] * inverseWindow);
        }
    }

    // Copies a chunk's values into a ring from the current slot on.
    private void ToRing(ReadOnlySpan<float> values, float[] ring)
    {
        var first = Math.Min(values.Length, _ring - _slot);
        values[..first].CopyTo(ring.AsSpan(_slot));
        values[first..].CopyTo(ring);
    }

    // The decision stage, sample by sample over the chunk the front end has just written: a fiducial mark 80 ms back
    // (it needs the fused signal 80 ms either side), then search-back when a beat is overdue. Most samples are neither
    // a local peak of the fused signal nor due for search-back, and change nothing: those are passed over in a tight
    // loop.
    private void Decide(int count)
    {
        var end = _n + count;
        while (_n < end)
        {
            DecideSample(end);
            if (_learned && _n - _peakHalfWidth >= _learnSamples)
            {
                var limit = Math.Min(end, _fusedUntil);
                if (_searchBackDue < long.MaxValue)
                {
                    limit = Math.Min(limit, _searchBackDue + _peakHalfWidth);
                }

                PassQuietSamples(limit);
            }
        }
    }

    private void DecideSample(long end)
    {
        if (_learned)
        {
            if (_n >= _fusedUntil)
            {
                FuseAhead((int)(end - _n));
            }

            var m = _n - _peakHalfWidth;
            var ms = _slot - _peakHalfWidth;
            ms = ms < 0 ? ms + _ring : ms;
            if (m >= _learnSamples && IsLocalPeak(ms))
            {
                CandidateAt(m, ms);
            }

            if (m >= _searchBackDue)
            {
                SearchBack(m);
            }
        }
        else if (_n + 1 == _learnSamples)
        {
            Learn();
        }

        _n++;
        _slot = Next(_slot);
    }

    // Moves on while samples before `limit` (fused values known, search-back not due) are not local peaks 80 ms back.
    private void PassQuietSamples(long limit)
    {
        var fused = _fused;
        var ring = _ring;
        var ms = _slot - _peakHalfWidth;
        ms = ms < 0 ? ms + ring : ms;
        var previous = fused[ms == 0 ? ring - 1 : ms - 1];
        var n = _n;
        while (n < limit)
        {
            var v = fused[ms];
            var next = ms + 1 == ring ? 0 : ms + 1;
            // One branch, rarely taken: '&' instead of '&&'.
            if ((v > previous) & (v >= fused[next]))
            {
                break;
            }

            previous = v;
            ms = next;
            n++;
        }

        _slot = (int)((_slot + (n - _n)) % ring);
        _n = n;
    }

    // Band-pass of the paper's front end: the QRS energy band, 5–15 Hz (Pan & Tompkins 1985).
    private const double BandLowHz = 5;
    private const double BandHighHz = 15;

    // Moving-window integration: the paper uses 150 ms at 200 Hz; 120 ms separated neighbouring complexes better on
    // MITDB (our measurement, MITDB all records).
    private const double IntegrationWindowMs = 120;
}
