using LongRecord.Analysis.Numerics;

namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>
/// Per-beat delineation of a conditioned multilead ECG: QRS onset and offset (width), the dominant R deflection,
/// P wave present or absent with its peak, and T-wave end. Stateful per recording (it keeps the recent beats' P windows
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
public sealed partial class BeatDelineator
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
    private readonly PreviousBeatLocator _previousBeat = new();
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
    private int[] _segmentStarts = [];
    private float[] _energy = [];
    private double[] _work = [];

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
            (float)_settings.AmplitudeOffFraction);
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
            Math.Max(1, _settings.PRepeatBeats),
            Math.Max(2, Samples(60)),
            Math.Max(1, Samples(12)),
            Math.Max(1, Samples(_settings.PRepeatToleranceMs)),
            new PWaveGate(
                (float)_settings.PMinAmplitudeMv,
                Samples(_settings.PMinHalfWidthMs),
                Samples(_settings.PMaxHalfWidthMs),
                (float)_settings.PRestRatio,
                (float)_settings.PLargestOtherRatio,
                (float)_settings.PRepeatShare,
                (float)_settings.PRepeatCorrelation),
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

    /// <summary>Per-lead T ends of the last beat, −1 where none (for tests and diagnostics).</summary>
    internal ReadOnlySpan<int> LastTEnds => _tEnds;

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

        // A previous beat before the window is not passed by the caller; it is found from the overlap of the windows.
        var known = context;
        if (known.PreviousFiducial is null && _previousBeat.Locate(window[..length]) is int located)
        {
            known = known with { PreviousFiducial = located };
        }

        _previousBeat.Remember(window[..length], fiducial);

        // Search limits: never past halfway to a neighbouring beat.
        var low = 1;
        var high = length - 2;
        if (known.PreviousFiducial is int prev && prev < fiducial)
        {
            low = Math.Max(low, (prev + fiducial) / 2);
        }

        if (known.NextFiducial is int next && next > fiducial)
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
            if (lead.Usable && SpanStatistics.HasNaN(raw))
            {
                lead.Usable = false; // a gap (NaN) inside the window
            }

            if (!lead.Usable)
            {
                continue;
            }

            usable++;
        }

        if (usable == 0)
        {
            return BeatDelineation.None;
        }

        // The QRS band and the slow-wave band of every lead, two leads (four recursions) at a time.
        var lanes = new FilterLanes();
        for (var k = 0; k < _leads; k++)
        {
            if (!_leadQrs[k].Usable)
            {
                continue;
            }

            var raw = window.Slice(k * length, length);
            lanes.Add(raw, _qrsLowPass, _qrsSignal.AsSpan(k * length, length));
            lanes.Add(raw, _waveLowPass, _waveSignal.AsSpan(k * length, length));
            if (lanes.Full)
            {
                lanes.Flush(_work);
            }
        }

        lanes.Flush(_work);
        for (var k = 0; k < _leads; k++)
        {
            if (_leadQrs[k].Usable)
            {
                Differentiate(_qrsSignal.AsSpan(k * length, length), _slope.AsSpan(k * length, length));
                Differentiate(_waveSignal.AsSpan(k * length, length), _waveSlope.AsSpan(k * length, length));
            }
        }

        var centre = LocateQrs(length, fiducial, low, high);
        var from = Math.Max(low, centre - _maxHalf);
        var to = Math.Min(high, centre + _maxHalf);

        // The light low-pass is needed only around the QRS (with a margin for the filter's start-up at the edges).
        var fineFrom = Math.Max(0, from - _fineMargin);
        var fineTo = Math.Min(length, to + _fineMargin + 1);
        for (var k = 0; k < _leads; k++)
        {
            if (_leadQrs[k].Usable)
            {
                lanes.Add(window.Slice(k * length + fineFrom, fineTo - fineFrom), _fineLowPass, _fineSignal.AsSpan(k * length + fineFrom, fineTo - fineFrom));
                if (lanes.Full)
                {
                    lanes.Flush(_work);
                }
            }
        }

        lanes.Flush(_work);
        for (var k = 0; k < _leads; k++)
        {
            ref var lead = ref _leadQrs[k];
            if (!lead.Usable)
            {
                continue;
            }

            var d = _slope.AsSpan(k * length, length);
            var (activity, noise) = NoiseSlope(d, _waveSlope.AsSpan(k * length, length), centre);
            QrsBoundarySearch.Find(_qrsSignal.AsSpan(k * length, length), d, _fineSignal.AsSpan(k * length, length), centre, from, to, _qrs, activity, noise, ref lead);
        }

        var (onsetAt, offsetAt, confidence) = MultileadQrs.Combine(_leadQrs, (float)_settings.MinLeadSlopeFraction, (float)_settings.LeadSnrFloor, _outlier);
        var onset = onsetAt >= 0 ? (int)Math.Round(onsetAt) : -1;
        var offset = offsetAt >= 0 ? (int)Math.Round(offsetAt) : -1;
        var rPeak = DominantDeflection(length, onset, offset, centre);
        var width = onset >= 0 && offset > onset ? (float)((offsetAt - onsetAt) * 1000.0 / _fs) : float.NaN;
        if (onset < 0 || offset < 0)
        {
            _lastTEndAfterFiducial = null;
            return new BeatDelineation(onset, offset, width, rPeak, -1, -1, -1, confidence);
        }

        var tEnd = TEnd(length, fiducial, onset, offset, known);
        var (pWave, pPeak) = PWave(length, fiducial, onset, known);
        _lastTEndAfterFiducial = tEnd >= 0 ? tEnd - fiducial : null;
        return new BeatDelineation(onset, offset, width, rPeak, pWave, pPeak, tEnd, confidence);
    }
}
