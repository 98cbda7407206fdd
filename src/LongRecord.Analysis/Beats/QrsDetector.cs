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
public sealed class QrsDetector
{
    private const int History = 8;

    private readonly double _fs;
    private readonly int _leads;
    private readonly int _window;
    private readonly int _refractory;
    private readonly int _tWaveLimit;
    private readonly int _peakHalfWidth;
    private readonly int _delay;
    private readonly int _learnSamples;
    private readonly int _ring;

    private readonly BiquadCascade[] _bandPass;
    private readonly float[][] _derivativeHistory;
    private readonly float[][] _squaredRing;
    private readonly double[] _integralSum;
    private readonly float[][] _bandPassed;
    private readonly float[][] _slope;
    private readonly float[][] _integrated;
    private readonly float[] _fused;

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
    private readonly int[] _windowSlots;
    private readonly int _chunk;
    private bool _learned;
    private double _spk;
    private double _npk;
    private double _rrAverage;
    private Candidate? _last;
    private bool _lastFinal = true;

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
        _windowSlots = new int[leads];
        _bandPass = new BiquadCascade[leads];
        _derivativeHistory = new float[leads][];
        _squaredRing = new float[leads][];
        _integralSum = new double[leads];
        _bandPassed = new float[leads][];
        _slope = new float[leads][];
        _integrated = new float[leads][];
        _fused = new float[_ring];
        _leadLevel = new double[leads];
        _leadNoise = new double[leads];
        _leadWeight = new double[leads];
        for (var k = 0; k < leads; k++)
        {
            _bandPass[k] = new BiquadCascade(new NWaves.Filters.Butterworth.BandPassFilter(BandLowHz / _fs, BandHighHz / _fs, 2).Tf);
            _derivativeHistory[k] = new float[4];
            _squaredRing[k] = new float[_window];
            _bandPassed[k] = new float[_ring];
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
        if (_scratch.Length < block.Length)
        {
            _scratch = new float[block.Length];
        }

        var bp = _scratch.AsSpan(0, _leads * count);
        block[..bp.Length].CopyTo(bp);
        for (var k = 0; k < _leads; k++)
        {
            var lead = bp.Slice(k * count, count);
            if (_n == 0 && count > 0)
            {
                _bandPass[k].SettleAt(lead[0]);
            }

            _bandPass[k].Process(lead);
        }

        // The front end runs lead by lead over chunks of at most one second (tight loops); the fusion and the
        // decisions then run sample by sample, reading the rings no further back than they hold.
        for (var done = 0; done < count;)
        {
            var chunk = Math.Min(count - done, _chunk);
            for (var k = 0; k < _leads; k++)
            {
                FrontEnd(k, bp.Slice(k * count + done, chunk));
            }

            for (var i = 0; i < chunk; i++)
            {
                var slot = _slot;
                if (_learned)
                {
                    _fused[slot] = (float)Fuse(slot);
                    FindCandidate();
                    SearchBackIfDue(_n - _peakHalfWidth);
                }
                else if (_n + 1 == _learnSamples)
                {
                    Learn();
                }

                _n++;
                _slot = _slot + 1 == _ring ? 0 : _slot + 1;
            }

            done += chunk;
        }
    }

    /// <summary>Ends the stream: the last pending beat becomes final.</summary>
    public void Flush()
    {
        FinaliseLast();
    }

    private int Ms(double ms) => (int)Math.Round(ms * 0.001 * _fs);

    // Derivative, squaring and moving-window integration of the paper, for one lead over a chunk whose first sample
    // is sample _n; results go into the rings at the chunk's slots.
    private void FrontEnd(int k, ReadOnlySpan<float> x)
    {
        var h = _derivativeHistory[k];
        float h0 = h[0], h1 = h[1], h2 = h[2], h3 = h[3];
        var squared = _squaredRing[k];
        var bandPassed = _bandPassed[k];
        var slope = _slope[k];
        var integrated = _integrated[k];
        var sum = _integralSum[k];
        var w = _windowSlots[k];
        var slot = _slot;
        var scale = (float)(_fs / 8.0);
        var inverseWindow = 1.0 / _window;
        for (var i = 0; i < x.Length; i++)
        {
            var v = x[i];
            // Five-point derivative of the paper: y = (2x[n] + x[n−1] − x[n−3] − 2x[n−4]) / 8 (per sample interval).
            var d = (2 * v + h0 - h2 - 2 * h3) * scale;
            h3 = h2;
            h2 = h1;
            h1 = h0;
            h0 = v;
            var sq = d * d;
            sum += sq - squared[w];
            squared[w] = sq;
            w = w + 1 == _window ? 0 : w + 1;
            bandPassed[slot] = v;
            slope[slot] = Math.Abs(d);
            integrated[slot] = (float)Math.Max(0, sum * inverseWindow);
            slot = slot + 1 == _ring ? 0 : slot + 1;
        }

        h[0] = h0;
        h[1] = h1;
        h[2] = h2;
        h[3] = h3;
        _integralSum[k] = sum;
        _windowSlots[k] = w;
    }

    // Band-pass of the paper's front end: the QRS energy band, 5–15 Hz (Pan & Tompkins 1985).
    private const double BandLowHz = 5;
    private const double BandHighHz = 15;

    // Moving-window integration: the paper uses 150 ms at 200 Hz; 120 ms separated neighbouring complexes better on
    // MITDB (our measurement, MITDB all records).
    private const double IntegrationWindowMs = 120;

    // Each lead's normalised integrated signal is clipped here so an artefact on one lead cannot outweigh the others
    // (our choice, no source).
    private const double LeadCap = 1.5;

    // Threshold I = NPKI + 0.3125 (SPKI − NPKI): Hamilton & Tompkins 1986's detection threshold coefficient (from memory).
    private const double ThresholdCoefficient = 0.3125;

    // How fast a lead's noise estimate rises when its noise grows (it falls at 1/8 per beat, the paper's level
    // update); our choice, no source.
    private const double NoiseAttack = 0.75;

    // The fiducial is sought over two integration windows before the integrated peak, so that broad and paced
    // complexes, whose energy comes late, still place it inside the complex (our measurement on MITDB).
    private const int FiducialWindows = 2;

    private double Fuse(int slot)
    {
        double f = 0, wsum = 0;
        for (var k = 0; k < _leads; k++)
        {
            // Clipped so that an artefact on one lead cannot outweigh the others.
            // Compression x^0.75 = sqrt(x·sqrt(x)).
            var x = _integrated[k][slot] / _leadLevel[k];
            f += _leadWeight[k] * Math.Min(LeadCap, Math.Sqrt(x * Math.Sqrt(x)));
            wsum += _leadWeight[k];
        }

        return f / wsum;
    }

    private void Learn()
    {
        double fmax = 0;
        for (var k = 0; k < _leads; k++)
        {
            double max = 0;
            for (var i = 0; i < _learnSamples; i++)
            {
                max = Math.Max(max, _integrated[k][i % _ring]);
            }

            _leadLevel[k] = Math.Max(max, 1e-12);
        }

        for (var i = 0; i < _learnSamples; i++)
        {
            _fused[i % _ring] = (float)Fuse(i % _ring);
            fmax = Math.Max(fmax, _fused[i % _ring]);
        }

        _spk = 0.5 * fmax;
        _npk = 0.1 * fmax;
        _learned = true;

        // The learning period's own beats: judged once the levels exist.
        for (long m = 1; m + _peakHalfWidth < _learnSamples; m++)
        {
            CandidateAt(m, (int)m);
        }
    }

    private float F(long t) => _fused[(int)(t % _ring)];

    // A fiducial mark: the largest value of the integrated signal within ±80 ms.
    private void FindCandidate()
    {
        var m = _n - _peakHalfWidth;
        if (m < _learnSamples)
        {
            return;
        }

        var ms = _slot - _peakHalfWidth;
        if (ms < 0)
        {
            ms += _ring;
        }

        CandidateAt(m, ms);
    }

    private void CandidateAt(long m, int ms)
    {
        var v = _fused[ms];
        if (v <= _fused[ms == 0 ? _ring - 1 : ms - 1] || v < _fused[ms + 1 == _ring ? 0 : ms + 1])
        {
            return;
        }

        for (var j = Math.Max(0, m - _peakHalfWidth); j <= m + _peakHalfWidth; j++)
        {
            if (j != m && (F(j) > v || (F(j) == v && j < m)))
            {
                return;
            }
        }

        OnCandidate(new Candidate(m, v, MaxSlope(m)));
    }

    private double Threshold1 => _npk + ThresholdCoefficient * (_spk - _npk);

    private void OnCandidate(Candidate c)
    {
        if (_last is Candidate last && !_lastFinal && c.Position - last.Position <= _refractory)
        {
            // Within the refractory period only the larger of two marks can be a QRS.
            if (c.Value > last.Value)
            {
                _last = c;
            }

            return;
        }

        if (_last is Candidate l && c.Position - l.Position <= _refractory)
        {
            return;
        }

        if (c.Value > Threshold1)
        {
            if (_last is Candidate prev && c.Position - prev.Position < _tWaveLimit && c.Slope < 0.5 * prev.Slope)
            {
                Noise(c);
                return;
            }

            FinaliseLast();
            _last = c;
            _lastFinal = false;
            _sinceLast.Clear();
        }
        else
        {
            Noise(c);
        }
    }

    private void Noise(Candidate c)
    {
        _noisePeaks[_noisePeakCount++ % History] = c.Value;
        _npk = Median(_noisePeaks, _noisePeakCount);
        _sinceLast.Add(c);
    }

    private void SearchBackIfDue(long now)
    {
        if (_last is not Candidate last || now - last.Position < 1.66 * _rrAverage)
        {
            return;
        }

        // Threshold II of the paper; it halves for every further two seconds without a beat so that the detector
        // recovers after an artefact has raised its levels.
        var overdueS = (now - last.Position - 1.66 * _rrAverage) / _fs;
        var threshold2 = 0.5 * Threshold1 * Math.Pow(0.5, Math.Max(0, overdueS - 1.0) / 2.0);
        var best = -1;
        for (var i = 0; i < _sinceLast.Count; i++)
        {
            var p = _sinceLast[i];
            var tWave = p.Position - last.Position < _tWaveLimit && p.Slope < 0.5 * last.Slope;
            if (!tWave && p.Position - last.Position > _refractory && p.Value > threshold2 && (best < 0 || p.Value > _sinceLast[best].Value))
            {
                best = i;
            }
        }

        if (best < 0)
        {
            return;
        }

        var found = _sinceLast[best];
        _sinceLast.RemoveRange(0, best + 1);
        _sinceLast.RemoveAll(p => p.Position - found.Position <= _refractory);
        FinaliseLast();
        _qrsPeaks[_qrsPeakCount++ % History] = found.Value;
        _spk = Median(_qrsPeaks, _qrsPeakCount);
        _last = found;
        _lastFinal = true;
        Emit(found, fromSearchBack: true);
    }

    private void FinaliseLast()
    {
        if (_last is Candidate c && !_lastFinal)
        {
            _qrsPeaks[_qrsPeakCount++ % History] = c.Value;
            _spk = Median(_qrsPeaks, _qrsPeakCount);
            _lastFinal = true;
            Emit(c, fromSearchBack: false);
        }
    }

    private long _lastEmitted = -1;

    private void Emit(Candidate c, bool fromSearchBack)
    {
        if (_lastEmitted >= 0)
        {
            _rr[_rrCount++ % History] = c.Position - _lastEmitted;
            _rrAverage = Mean(_rr, _rrCount);
        }

        UpdateLeads(c.Position);
        _lastEmitted = c.Position;
        _output.Add(LocateFiducial(c.Position));
    }

    private void UpdateLeads(long pos)
    {
        for (var k = 0; k < _leads; k++)
        {
            double peak = 0;
            for (var t = Math.Max(0, pos - _window / 2); t <= pos + _window / 2 && t < _n; t++)
            {
                peak = Math.Max(peak, _integrated[k][(int)(t % _ring)]);
            }

            double between = 0;
            // No further back than the rings hold behind a chunk the front end has already written ahead.
            var from = Math.Max(Math.Max(0, _lastEmitted + _refractory + _window), pos - _ring + _chunk + _peakHalfWidth + 1);
            for (var t = from; t < pos - _window; t++)
            {
                between = Math.Max(between, _integrated[k][(int)(t % _ring)]);
            }

            _leadLevel[k] = 0.875 * _leadLevel[k] + 0.125 * Math.Max(peak, 1e-12);
            var noise = Math.Min(1.0, Math.Sqrt(between / _leadLevel[k]));
            var a = noise > _leadNoise[k] ? NoiseAttack : 0.125;
            _leadNoise[k] = (1 - a) * _leadNoise[k] + a * noise;
            var q = Math.Clamp(1.0 - _leadNoise[k], 0.02, 1.0);
            _leadWeight[k] = q * q;
        }
    }

    private double MaxSlope(long pos)
    {
        double best = 0;
        var from = Math.Max(pos - _window - _delay, (_last?.Position ?? -1) + 1);
        for (var k = 0; k < _leads; k++)
        {
            double m = 0;
            for (var t = Math.Max(Math.Max(0, from), _n + _chunk - _ring + 1); t <= pos; t++)
            {
                m = Math.Max(m, _slope[k][(int)(t % _ring)]);
            }

            best = Math.Max(best, _leadWeight[k] * m / Math.Sqrt(_leadLevel[k]));
        }

        return best;
    }

    // The centre of the QRS slope energy across leads: robust for broad and paced complexes, where the largest
    // deflection can come late in the complex.
    private long LocateFiducial(long pos)
    {
        double sum = 0, moment = 0;
        var from = Math.Max(Math.Max(0, pos - FiducialWindows * _window - _delay), _n + _chunk - _ring + 1);
        for (var t = from; t <= pos; t++)
        {
            double e = 0;
            for (var k = 0; k < _leads; k++)
            {
                var v = _slope[k][(int)(t % _ring)];
                e += _leadWeight[k] * v * v / _leadLevel[k];
            }

            sum += e;
            moment += e * (t - from);
        }

        var at = sum > 0 ? from + (long)Math.Round(moment / sum) : pos;
        return Math.Max(0, at - _delay);
    }

    private static double Median(double[] values, int count)
    {
        var n = Math.Min(count, values.Length);
        Span<double> tmp = stackalloc double[n];
        values.AsSpan(0, n).CopyTo(tmp);
        tmp.Sort();
        return n % 2 == 1 ? tmp[n / 2] : 0.5 * (tmp[n / 2 - 1] + tmp[n / 2]);
    }

    private static double Mean(double[] values, int count)
    {
        var n = Math.Min(count, values.Length);
        double s = 0;
        for (var i = 0; i < n; i++)
        {
            s += values[i];
        }

        return s / n;
    }

    private readonly record struct Candidate(long Position, double Value, double Slope);
}
