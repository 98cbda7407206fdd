namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>
/// Per-beat delineation of a conditioned multilead ECG: QRS onset and offset (width), the dominant R deflection,
/// P wave present or absent with its peak, and T-wave end. Stateful per recording (it keeps a running P-wave template
/// and the previous beat's T end), so feed it the beats of one recording in time order. Buffers are reused: no
/// allocation per beat once the largest window has been seen.
/// </summary>
/// <remarks>
/// The method follows Laguna P, Jané R, Caminal P. "Automatic detection of wave boundaries in multilead ECG signals:
/// validation with the CSE database." Comput Biomed Res 27:45–60 (1994): each lead is low-passed and differentiated;
/// the QRS slope peaks are found, and each boundary is where the slope falls below a threshold relative to the peak of
/// the wave it belongs to; P and T waves are searched in windows placed relative to the QRS on a more strongly
/// low-passed lead; the multilead boundaries are the earliest onset and latest end over the leads, with a rule that
/// sets aside a lead whose boundary disagrees with the others.
/// </remarks>
public sealed class BeatDelineator
{
    private readonly double _fs;
    private readonly int _leads;
    private readonly DelineationSettings _settings;
    private readonly ZeroPhaseLowPass _qrsLowPass;
    private readonly ZeroPhaseLowPass _waveLowPass;
    private readonly ZeroPhaseLowPass _fineLowPass;
    private readonly QrsSearchSamples _qrs;
    private readonly int _locate;
    private readonly int _maxHalf;
    private readonly int _outlier;
    private readonly int _fineMargin;
    private readonly LeadQrs[] _leadQrs;
    private readonly LeadP[] _leadP;
    private readonly PWaveSearch _pSearch;
    private readonly TWaveSamples _t;
    private int? _lastTEndAfterFiducial;
    private readonly int[] _tEnds;
    private readonly float[] _tAmplitudes;
    private float[] _qrsSignal = [];
    private float[] _slope = [];
    private float[] _fineSignal = [];
    private float[] _waveSignal = [];
    private float[] _waveSlope = [];
    private float[] _scratch = [];
    private float[] _energy = [];

    /// <summary>Creates a delineator for <paramref name="leads"/> leads sampled at <paramref name="samplingRateHz"/>.</summary>
    public BeatDelineator(double samplingRateHz, int leads, DelineationSettings? settings = null)
    {
        if (!(samplingRateHz > 0) || !double.IsFinite(samplingRateHz))
        {
            throw new ArgumentOutOfRangeException(nameof(samplingRateHz), samplingRateHz, "sampling rate must be a positive number");
        }

        if (leads is < 1 or > 64)
        {
            throw new ArgumentOutOfRangeException(nameof(leads), leads, "between 1 and 64 leads");
        }

        _fs = samplingRateHz;
        _leads = leads;
        _settings = settings ?? DelineationSettings.Default;
        _qrsLowPass = new ZeroPhaseLowPass(_settings.QrsLowPassHz, samplingRateHz);
        _waveLowPass = new ZeroPhaseLowPass(_settings.WaveLowPassHz, samplingRateHz);
        _fineLowPass = new ZeroPhaseLowPass(_settings.QrsFineLowPassHz, samplingRateHz);
        _qrs = new QrsSearchSamples(
            Math.Max(1, Samples(_settings.QrsPeakSearchMs)),
            Math.Max(1, Samples(_settings.NotchMs)),
            Math.Max(2, Samples(_settings.QuietGapMs)),
            Math.Max(2, Samples(_settings.WaveLimbMs)),
            (float)_settings.SignificantSlopeFraction,
            (float)_settings.WeakSlopeFraction,
            (float)_settings.SignificantAmplitudeFraction,
            (float)_settings.QuietSlopeFraction,
            (float)_settings.OnsetDivisor,
            (float)_settings.OffsetDivisor,
            (float)_settings.NoiseSlopeMultiple,
            Samples(_settings.SustainMs),
            (float)_settings.GlobalOnFraction,
            (float)_settings.GlobalOffFraction,
            Math.Max(1, Samples(_settings.LevelMs)),
            (float)_settings.AmplitudeOnFraction,
            (float)_settings.AmplitudeOffFraction,
            Math.Max(1, Samples(8)),
            Samples(_settings.TailMs),
            (float)_settings.TailFraction,
            (float)_settings.TailReverseFraction);
        _locate = Samples(_settings.QrsLocateMs);
        _maxHalf = Samples(_settings.QrsMaxHalfMs);
        _outlier = Samples(_settings.LeadOutlierMs);
        _fineMargin = Samples(40);
        _leadQrs = new LeadQrs[leads];
        _leadP = new LeadP[leads];
        _tEnds = new int[leads];
        _tAmplitudes = new float[leads];
        _pSearch = new PWaveSearch(leads, new PWaveSamples(
            Samples(_settings.PWindowMs),
            Math.Max(1, Samples(5)),
            Samples(_settings.PMinWindowMs),
            Math.Max(1, Samples(16)),
            Samples(_settings.PPeakEarliestMs),
            Samples(_settings.PPeakLatestMs),
            Math.Max(1, Samples(20)),
            Samples(_settings.PWindowMs),
            Math.Max(1, _settings.PHistoryBeats),
            Samples(_settings.PRestBeforeMs),
            Math.Max(2, Samples(60)),
            Math.Max(1, Samples(12)),
            Math.Max(1, Samples(_settings.PPrToleranceMs)),
            new PWaveGate(
                (float)_settings.PMinAmplitudeMv,
                Samples(_settings.PMinHalfWidthMs),
                Samples(_settings.PMaxHalfWidthMs),
                (float)_settings.PStrictRatio,
                (float)_settings.PPeakRatio,
                (float)_settings.PPrAgreement,
                (float)_settings.PTemplateCorrelation),
            Math.Max(1, Samples(8))));
        _t = new TWaveSamples(Samples(_settings.TStDelayMs), Samples(_settings.TMaxAfterQrsMs), Math.Max(2, Samples(60)), Math.Max(1, Samples(20)), Samples(_settings.TDescentMs), Samples(_settings.TReferenceMs));
    }

    /// <summary>Sampling rate the delineator was built for, Hz.</summary>
    public double SamplingRateHz => _fs;

    /// <summary>Number of leads in each window.</summary>
    public int Leads => _leads;

    /// <summary>Per-lead QRS figures of the last beat (for tests and diagnostics).</summary>
    internal ReadOnlySpan<LeadQrs> LastLeads => _leadQrs;

    /// <summary>Per-lead P-wave figures of the last beat (for tests and diagnostics).</summary>
    internal ReadOnlySpan<LeadP> LastP => _leadP;

    internal ReadOnlySpan<int> LastTEnds => _tEnds;

    internal ReadOnlySpan<float> LastTAmplitudes => _tAmplitudes;

    /// <summary>The QRS-band slope of lead <paramref name="k"/> for the last window (diagnostics).</summary>
    internal ReadOnlySpan<float> LastSlope(int k, int length) => _slope.AsSpan(k * length, length);

    /// <summary>The QRS-band signal of lead <paramref name="k"/> for the last window (diagnostics).</summary>
    internal ReadOnlySpan<float> LastQrsSignal(int k, int length) => _qrsSignal.AsSpan(k * length, length);

    /// <summary>
    /// Delineates the beat whose detector fiducial is at <paramref name="fiducial"/> inside <paramref name="window"/>:
    /// conditioned samples of every lead, lead-major (lead k at k × <paramref name="length"/>), normally spanning about
    /// 0.5 s before and 0.7 s after the fiducial (shorter near the ends of a recording). Indices in the result are
    /// relative to the window.
    /// </summary>
    public BeatDelineation Delineate(ReadOnlySpan<float> window, int length, int fiducial, in DelineationContext context)
    {
        if (length <= 0 || window.Length < _leads * length)
        {
            throw new ArgumentException($"window holds {window.Length} samples, fewer than {_leads} leads × {length}", nameof(window));
        }

        if ((uint)fiducial >= (uint)length)
        {
            throw new ArgumentOutOfRangeException(nameof(fiducial), fiducial, "fiducial must lie inside the window");
        }

        Grow(length);
        var mask = context.UsableLeadMask == 0 ? ulong.MaxValue : context.UsableLeadMask;

        // Search limits: never past halfway to a neighbouring beat.
        var low = 1;
        var high = length - 2;
        if (context.PreviousFiducial is int prev && prev < fiducial)
        {
            low = Math.Max(low, (prev + fiducial) / 2);
        }

        if (context.NextFiducial is int next && next > fiducial)
        {
            high = Math.Min(high, (fiducial + next) / 2);
        }

        var usable = 0;
        for (var k = 0; k < _leads; k++)
        {
            ref var lead = ref _leadQrs[k];
            lead = default;
            lead.Onset = lead.Offset = -1;
            lead.OnsetAt = lead.OffsetAt = -1;
            var raw = window.Slice(k * length, length);
            lead.Usable = k >= 64 || (mask & (1UL << k)) != 0;
            if (lead.Usable && raw.IndexOfAnyExceptInRange(float.NegativeInfinity, float.PositiveInfinity) >= 0)
            {
                lead.Usable = false; // a gap (NaN) inside the window
            }

            if (!lead.Usable)
            {
                continue;
            }

            usable++;

            // The QRS band and the slow-wave band of the lead in one pass pair (independent recursions overlap).
            var x = _qrsSignal.AsSpan(k * length, length);
            var w = _waveSignal.AsSpan(k * length, length);
            raw.CopyTo(x);
            raw.CopyTo(w);
            _qrsLowPass.ApplyPair(x, _waveLowPass, w);
            Differentiate(x, _slope.AsSpan(k * length, length));
        }

        if (usable == 0)
        {
            return BeatDelineation.None;
        }

        var centre = LocateQrs(length, fiducial, low, high);
        var from = Math.Max(low, centre - _maxHalf);
        var to = Math.Min(high, centre + _maxHalf);

        // The light low-pass is needed only around the QRS (with a margin for the filter's start-up at the edges).
        var fineFrom = Math.Max(0, from - _fineMargin);
        var fineTo = Math.Min(length, to + _fineMargin + 1);
        for (var k = 0; k < _leads; k++)
        {
            ref var lead = ref _leadQrs[k];
            if (!lead.Usable)
            {
                continue;
            }

            var fine = _fineSignal.AsSpan(k * length, length);
            _fineLowPass.Apply(window.Slice(k * length + fineFrom, fineTo - fineFrom), fine[fineFrom..fineTo]);
            var d = _slope.AsSpan(k * length, length);
            QrsBoundarySearch.Find(_qrsSignal.AsSpan(k * length, length), d, fine, centre, from, to, _qrs, NoiseSlope(d, centre, context), ref lead);
        }

        var (onsetAt, offsetAt, confidence) = MultileadQrs.Combine(_leadQrs, (float)_settings.MinLeadSlopeFraction, (float)_settings.MinLeadSnr, (float)_settings.LeadSnrFloor, _outlier);
        var onset = onsetAt >= 0 ? (int)Math.Round(onsetAt) : -1;
        var offset = offsetAt >= 0 ? (int)Math.Round(offsetAt) : -1;
        var rPeak = DominantDeflection(length, onset, offset, centre);
        var width = onset >= 0 && offset > onset ? (float)((offsetAt - onsetAt) * 1000.0 / _fs) : float.NaN;
        if (onset < 0 || offset < 0)
        {
            _lastTEndAfterFiducial = null;
            return new BeatDelineation(onset, offset, width, rPeak, -1, -1, -1, confidence);
        }

        for (var k = 0; k < _leads; k++)
        {
            if (_leadQrs[k].Usable)
            {
                Differentiate(_waveSignal.AsSpan(k * length, length), _waveSlope.AsSpan(k * length, length));
            }
        }

        var tEnd = TEnd(length, fiducial, onset, offset, context);
        var (pWave, pPeak) = PWave(length, fiducial, onset, context);
        _lastTEndAfterFiducial = tEnd >= 0 ? tEnd - fiducial : null;
        return new BeatDelineation(onset, offset, width, rPeak, pWave, pPeak, tEnd, confidence);
    }

    private int TEnd(int length, int fiducial, int onset, int offset, in DelineationContext context)
    {
        var limit = Math.Min(length - 2, fiducial + Samples(650));
        if (context.NextFiducial is int next && next > fiducial)
        {
            // Stop before the next beat's P wave.
            limit = Math.Min(limit, next - Math.Max(Samples(150), (int)(0.35 * (next - fiducial))));
        }

        // The QT interval is bounded by the heart rate (a QTc of 0.52 s by Bazett's formula, RR in seconds; from memory).
        var rr = context.NextFiducial is int n2 && n2 > fiducial ? n2 - fiducial
            : context.PreviousFiducial is int p2 && p2 < fiducial ? fiducial - p2 : Samples(1000);
        var t = _t with { MaxQt = Samples(1000 * _settings.TMaxQtcS * Math.Sqrt(Math.Clamp(rr / _fs, 0.3, 2.0))) };
        var best = -1;
        var bestAmplitude = 0f;
        var ends = _tEnds.AsSpan();
        var amplitudes = _tAmplitudes.AsSpan();
        for (var k = 0; k < ends.Length; k++)
        {
            ends[k] = -1;
            if (!_leadQrs[k].Usable)
            {
                continue;
            }

            ends[k] = TWaveEndSearch.Find(_waveSignal.AsSpan(k * length, length), _waveSlope.AsSpan(k * length, length), onset, offset, limit, t, out var a);
            amplitudes[k] = Math.Abs(a);
            bestAmplitude = Math.Max(bestAmplitude, ends[k] >= 0 ? amplitudes[k] : 0);
        }

        // The lead with the tallest T wave leads; another tall lead may extend the end a little (the latest end over
        // the clear leads, as QT practice takes it), never far.
        var tallest = -1;
        for (var k = 0; k < ends.Length; k++)
        {
            if (ends[k] >= 0 && amplitudes[k] >= _settings.TMinAmplitudeMv && (tallest < 0 || amplitudes[k] > amplitudes[tallest]))
            {
                tallest = k;
            }
        }

        if (tallest < 0)
        {
            return -1;
        }

        best = ends[tallest];
        var near = Samples(_settings.TLeadAgreementMs);
        for (var k = 0; k < ends.Length; k++)
        {
            if (ends[k] > best && ends[k] - ends[tallest] <= near && amplitudes[k] >= 0.5f * amplitudes[tallest])
            {
                best = ends[k];
            }
        }

        return best;
    }

    private (sbyte PWave, int PPeak) PWave(int length, int fiducial, int onset, in DelineationContext context)
    {
        // The window starts after the previous T wave: its measured end, or an estimate from the RR interval.
        var start = 0;
        if (context.PreviousFiducial is int prev && prev < fiducial)
        {
            start = _lastTEndAfterFiducial is int t
                ? prev + t + Samples(20)
                : prev + Math.Min((int)(0.6 * (fiducial - prev)), Samples(450));

            // A T end found late must not hide a P wave the beat-to-beat tests can still judge.
            start = Math.Min(start, onset - Samples(_settings.PMinWindowMs) - Math.Max(1, Samples(5)));
        }

        var judged = false;
        var best = -1;
        var bestRatio = 0f;
        for (var k = 0; k < _leads; k++)
        {
            ref var p = ref _leadP[k];
            p = default;
            p.Peak = -1;
            if (!_leadQrs[k].Usable)
            {
                continue;
            }

            var y = _waveSignal.AsSpan(k * length, length);
            p = _pSearch.Measure(k, y, start, onset, _scratch);
            if (!p.Judged)
            {
                continue;
            }

            judged = true;
            if (p.Accepted && p.Ratio > bestRatio)
            {
                bestRatio = p.Ratio;
                best = p.Peak;
            }
        }

        return !judged ? ((sbyte)-1, -1) : best >= 0 ? ((sbyte)1, best) : ((sbyte)0, -1);
    }

    private int LocateQrs(int length, int fiducial, int low, int high)
    {
        // Centre of the QRS = the peak of the summed squared slopes, smoothed over ~40 ms, near the fiducial.
        var half = Math.Max(1, Samples(20));
        var from = Math.Max(low, fiducial - _locate);
        var to = Math.Min(high, fiducial + _locate);
        var e = _energy.AsSpan(0, length);
        var first = Math.Max(0, from - half);
        var last = Math.Min(length, to + half + 1);
        e[first..last].Clear();
        for (var k = 0; k < _leads; k++)
        {
            if (!_leadQrs[k].Usable)
            {
                continue;
            }

            var d = _slope.AsSpan(k * length, length);
            for (var i = first; i < last; i++)
            {
                e[i] += d[i] * d[i];
            }
        }

        double sum = 0;
        for (var i = Math.Max(0, from - half); i < Math.Min(length, from + half + 1); i++)
        {
            sum += e[i];
        }

        var best = fiducial;
        var bestSum = -1.0;
        for (var i = from; i <= to; i++)
        {
            if (sum > bestSum)
            {
                bestSum = sum;
                best = i;
            }

            var add = i + half + 1;
            var drop = i - half;
            if (add < last)
            {
                sum += e[add];
            }

            if (drop >= first)
            {
                sum -= e[drop];
            }
        }

        return best;
    }

    private float NoiseSlope(ReadOnlySpan<float> d, int centre, in DelineationContext context)
    {
        // The typical absolute slope away from this beat's and the neighbouring beats' QRS: what the lead shows when no
        // QRS is there. A scaled mean rather than a quantile: 1.6 × the mean absolute value is the 80th percentile of a
        // Gaussian's absolute value (1.28 σ ÷ 0.80 σ).
        var exclude = Samples(_settings.NoiseExclusionMs);
        var prev = context.PreviousFiducial ?? int.MinValue / 2;
        var next = context.NextFiducial ?? int.MaxValue / 2;
        double sum = 0;
        var n = 0;
        for (var i = 0; i < d.Length; i++)
        {
            if (Math.Abs(i - centre) > exclude && Math.Abs(i - prev) > exclude && Math.Abs(i - next) > exclude)
            {
                sum += Math.Abs(d[i]);
                n++;
            }
        }

        return n == 0 ? 0f : (float)(_settings.NoiseMeanScale * sum / n);
    }

    private int DominantDeflection(int length, int onset, int offset, int centre)
    {
        var best = -1;
        var bestRatio = -1f;
        for (var k = 0; k < _leads; k++)
        {
            ref readonly var lead = ref _leadQrs[k];
            if (lead.Usable && lead.Snr > bestRatio)
            {
                bestRatio = lead.Snr;
                best = k;
            }
        }

        if (best < 0)
        {
            return -1;
        }

        var x = _qrsSignal.AsSpan(best * length, length);
        var a = onset >= 0 ? onset : Math.Max(0, centre - Samples(60));
        var b = offset >= 0 ? offset : Math.Min(length - 1, centre + Samples(60));
        var level = 0.5f * (x[a] + x[b]);
        var at = centre;
        var most = -1f;
        for (var i = a; i <= b; i++)
        {
            var v = Math.Abs(x[i] - level);
            if (v > most)
            {
                most = v;
                at = i;
            }
        }

        return at;
    }

    private float PeakToPeak(ReadOnlySpan<float> x, int onset, int offset, int centre)
    {
        var a = onset >= 0 ? onset : Math.Max(0, centre - Samples(60));
        var b = offset >= 0 ? offset : Math.Min(x.Length - 1, centre + Samples(60));
        var min = float.MaxValue;
        var max = float.MinValue;
        for (var i = a; i <= b; i++)
        {
            min = Math.Min(min, x[i]);
            max = Math.Max(max, x[i]);
        }

        return max - min;
    }

    private void Differentiate(ReadOnlySpan<float> x, Span<float> d)
    {
        // Central difference in mV/s, so slope thresholds do not depend on the sampling rate.
        var scale = (float)(_fs / 2);
        var n = x.Length;
        for (var i = 1; i < n - 1; i++)
        {
            d[i] = (x[i + 1] - x[i - 1]) * scale;
        }

        d[0] = n > 1 ? d[1] : 0;
        if (n > 1)
        {
            d[n - 1] = d[n - 2];
        }
    }

    private void Grow(int length)
    {
        if (_energy.Length >= length)
        {
            return;
        }

        _qrsSignal = new float[_leads * length];
        _slope = new float[_leads * length];
        _fineSignal = new float[_leads * length];
        _waveSignal = new float[_leads * length];
        _waveSlope = new float[_leads * length];
        _scratch = new float[length];
        _energy = new float[length];
    }

    private int Samples(double ms) => (int)Math.Round(ms * _fs / 1000.0);
}
