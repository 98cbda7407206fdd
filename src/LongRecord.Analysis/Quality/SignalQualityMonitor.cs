namespace LongRecord.Analysis.Quality;

/// <summary>
/// Streaming signal-quality monitor: judges every lead in one-second windows (good, noisy, unreadable, chaotic, flat,
/// saturated, missing) and each window as analysable or not, with a <see cref="QualityReason"/>. Raw samples (mV, NaN
/// where missing) show flat, saturated and missing leads; the conditioned samples
/// (<see cref="Conditioning.EcgConditioner"/>) show noise, judged against the lead's own QRS: the quiet level of the
/// QRS-band slope between complexes, the low-frequency activity, and the beat-to-beat residual outside the QRS, over
/// the two seconds around the window. A lead is unreadable only for runs of windows and never while its complexes
/// repeat beat after beat; a window is analysable while any lead is usable; continuous narrow-band activity with no QRS
/// on every lead is reported as chaotic, flat signal on every lead as flat — both handed on, not only excluded.
/// Windows are finished in order, <see cref="LatencySamples"/> behind the input; the same windows come out for any
/// block size. Memory does not grow with the recording except for the merged stretches.
/// </summary>
public sealed partial class SignalQualityMonitor
{
    /// <summary>Length of a quality window. One second holds a QRS at any rate above 60 per minute and keeps lead-off edges to a second.</summary>
    public const double WindowS = 1.0;

    private const int BlocksPerWindow = 10;
    private const int ContextBlocks = 5;
    private const int ResidualShiftBlocks = 4;

    private readonly double _fs;
    private readonly int _leads;
    private readonly QualitySettings _settings;
    private readonly LeadSignalBlocks[] _blocks;
    private readonly LeadWindowAssessor[] _assessors;
    private readonly BeatResidualTracker[] _residuals;
    private readonly LeadWindowFeatures[] _features;
    private readonly WindowDecisions _decisions;
    private readonly ChaoticBridge _bridge;
    private readonly List<QualityWindow> _decided = new();
    private readonly List<QualityWindow> _finished = new();
    private readonly List<QualityStretch> _stretches = new();
    private readonly List<LeadStretch>[] _leadStretches;
    private readonly float[] _scratch;
    private long _n;
    private long _block;
    private long _nextWindow;
    private bool _flushed;

    /// <summary>
    /// A monitor for one recording of <paramref name="leads"/> leads (1–16) at <paramref name="samplingRateHz"/> (at
    /// least 50 Hz); <paramref name="settings"/> carries the rails in mV per lead and the thresholds.
    /// </summary>
    public SignalQualityMonitor(double samplingRateHz, int leads, QualitySettings? settings = null)
    {
        if (!(samplingRateHz >= 50) || double.IsInfinity(samplingRateHz))
        {
            throw new ArgumentOutOfRangeException(nameof(samplingRateHz), samplingRateHz, "the sampling rate must be at least 50 Hz");
        }

        if (leads is < 1 or > QualityWindow.MaxLeads)
        {
            throw new ArgumentOutOfRangeException(nameof(leads), leads, $"the monitor handles 1 to {QualityWindow.MaxLeads} leads");
        }

        _settings = settings ?? QualitySettings.Default;
        _settings.Validate(leads);
        _fs = samplingRateHz;
        _leads = leads;
        _blocks = new LeadSignalBlocks[leads];
        _assessors = new LeadWindowAssessor[leads];
        _residuals = new BeatResidualTracker[leads];
        _leadStretches = new List<LeadStretch>[leads];
        for (var k = 0; k < leads; k++)
        {
            var low = _settings.RailLowMv is { } lo ? lo[k] : double.NaN;
            var high = _settings.RailHighMv is { } hi ? hi[k] : double.NaN;
            _blocks[k] = new LeadSignalBlocks(samplingRateHz, low, high, _settings);
            _assessors[k] = new LeadWindowAssessor(_settings);
            _residuals[k] = new BeatResidualTracker(samplingRateHz);
            _leadStretches[k] = new List<LeadStretch>();
        }

        _features = new LeadWindowFeatures[leads];
        _decisions = new WindowDecisions(_settings, leads, samplingRateHz);
        _bridge = new ChaoticBridge(_settings.ChaoticBridgeWindows);
        _scratch = new float[_blocks[0].RingLength];
    }

    public double SamplingRateHz => _fs;
    public int Leads => _leads;

    /// <summary>Samples per lead fed so far.</summary>
    public long SamplesSeen => _n;

    /// <summary>How far the finished windows trail the input: the centred context plus the windows a decision waits for.</summary>
    /// <remarks>Noise windows that might touch fibrillation are held up to <see cref="QualitySettings.ChaoticBridgeWindows"/> windows longer.</remarks>
    public long LatencySamples => (long)Math.Ceiling((_decisions.LookaheadWindows + 1 + 0.5) * WindowS * _fs);

    /// <summary>Windows finished by the last <see cref="Process"/> or <see cref="Flush"/> call, in order (the list is reused).</summary>
    public IReadOnlyList<QualityWindow> Finished => _finished;

    /// <summary>All finished windows merged into stretches of equal verdict.</summary>
    public IReadOnlyList<QualityStretch> Stretches => _stretches;

    /// <summary>End (exclusive) of the last finished window: lead states are known for earlier samples.</summary>
    public long DecidedUntilSample => _stretches.Count == 0 ? 0 : _stretches[^1].EndSample;

    /// <summary>Finished windows of lead <paramref name="lead"/> merged into stretches of equal state.</summary>
    public IReadOnlyList<LeadStretch> LeadStretches(int lead) => _leadStretches[CheckLead(lead)];

    /// <summary>
    /// Feeds <paramref name="count"/> samples of every lead, lead-major (lead k at k × count): raw in mV with NaN for
    /// missing samples, and the same samples conditioned.
    /// </summary>
    public void Process(ReadOnlySpan<float> rawLeadMajor, ReadOnlySpan<float> conditionedLeadMajor, int count)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        if (rawLeadMajor.Length < (long)_leads * count || conditionedLeadMajor.Length < (long)_leads * count)
        {
            throw new ArgumentException($"each block needs {_leads} × {count} samples", nameof(rawLeadMajor));
        }

        if (_flushed)
        {
            throw new InvalidOperationException("the monitor was flushed; start a new one for a new recording");
        }

        _finished.Clear();
        var i = 0;
        while (i < count)
        {
            var blockEnd = BlockStart(_block + 1);
            var take = (int)Math.Min(count - i, blockEnd - _n);
            for (var k = 0; k < _leads; k++)
            {
                _blocks[k].Add(rawLeadMajor.Slice(k * count + i, take), conditionedLeadMajor.Slice(k * count + i, take));
            }

            _n += take;
            i += take;
            if (_n == blockEnd)
            {
                CloseBlock();
                while ((_nextWindow * BlocksPerWindow) + BlocksPerWindow + ContextBlocks <= _block)
                {
                    AssessWindow();
                }
            }
        }
    }

    /// <summary>Ends the recording: the last, possibly shorter, window and every pending window are finished.</summary>
    public void Flush()
    {
        _finished.Clear();
        if (_flushed)
        {
            return;
        }

        _flushed = true;
        if (_n > BlockStart(_block))
        {
            CloseBlock();
        }

        while (_nextWindow * BlocksPerWindow < _block)
        {
            AssessWindow();
        }

        _decisions.End();
        Decide();
        var first = _finished.Count;
        _bridge.End(_finished);
        Publish(first);
    }

    private int CheckLead(int lead)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(lead);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(lead, _leads);
        return lead;
    }

    private long BlockStart(long block) => (long)Math.Round(block * _fs / BlocksPerWindow);

    private void CloseBlock()
    {
        for (var k = 0; k < _leads; k++)
        {
            _blocks[k].Close(_block);
        }

        _block++;
        for (var k = 0; k < _leads; k++)
        {
            _residuals[k].OnBlockClosed(_blocks[k], _block, _assessors[k].SlopeReference);
        }
    }

    private void AssessWindow()
    {
        var w = _nextWindow++;
        var ownFrom = w * BlocksPerWindow;
        var ownTo = Math.Min(ownFrom + BlocksPerWindow, _block);
        var contextFrom = Math.Max(0, ownFrom - ContextBlocks);
        var contextTo = Math.Min(ownFrom + BlocksPerWindow + ContextBlocks, _block);
        // Beats are measured 400 ms after their R, so the residual's context sits 0.4 s earlier than the others.
        var residualFrom = BlockStart(Math.Max(0, ownFrom - ContextBlocks - ResidualShiftBlocks));
        var residualTo = BlockStart(ownFrom + BlocksPerWindow + ContextBlocks - ResidualShiftBlocks);
        for (var k = 0; k < _leads; k++)
        {
            var residual = _residuals[k].MedianResidual(residualFrom, residualTo);
            var complexes = _residuals[k].CountComplexes(residualFrom, residualTo);
            _features[k] = _assessors[k].Assess(_blocks[k], ownFrom, ownTo, contextFrom, contextTo, residual, complexes);
        }

        var chaotic = IsChaoticCandidate(BlockStart(contextFrom), Math.Min(BlockStart(contextTo), _n));
        _decisions.Add(BlockStart(ownFrom), Math.Min(BlockStart(ownTo), _n), _features, chaotic);
        Decide();
    }

    // Every lead with a signal lacks a standing-out QRS, not every one shows complexes repeating beat after beat
    // (supraventricular and ventricular tachycardia stay analysable, however fast and broad) unless it is a pure
    // sinusoid (flutter), and one lead is narrow-band in the fibrillation range with an amplitude of the order of its
    // QRS complexes.
    private bool IsChaoticCandidate(long fromSample, long toSample)
    {
        var s = _settings;
        var signal = 0;
        for (var k = 0; k < _leads; k++)
        {
            if (_features[k].HasSignal)
            {
                signal++;
                if (!_features[k].LacksQrs(s))
                {
                    return false;
                }
            }
        }

        if (signal == 0)
        {
            return false;
        }

        var span = _scratch.AsSpan(0, (int)(toSample - fromSample));
        bool narrowBand = false, allOrganised = true;
        for (var k = 0; k < _leads; k++)
        {
            var f = _features[k];
            if (!f.HasSignal)
            {
                continue;
            }

            _blocks[k].CopyRange(fromSample, toSample, span);
            var (leakage, meanHz) = NarrowBand.Measure(span, _fs);
            allOrganised &= f.ResidualIndex < s.ChaoticOrganisedResidualIndex && leakage >= s.SinusoidLeakage;
            // A NaN amplitude ratio (no QRS reference yet) does not bar the lead.
            narrowBand |= !(f.AmplitudeRatio < s.ChaoticMinAmplitude)
                && leakage < s.ChaoticLeakage && meanHz >= s.ChaoticMinHz && meanHz <= s.ChaoticMaxHz;
        }

        return narrowBand && !allOrganised;
    }

    private void Decide()
    {
        _decided.Clear();
        _decisions.Decide(_decided);
        var first = _finished.Count;
        foreach (var w in _decided)
        {
            _bridge.Add(w, _finished);
        }

        Publish(first);
    }

    private void Publish(int first)
    {
        for (var i = first; i < _finished.Count; i++)
        {
            var window = _finished[i];
            QualityStretches.Append(_stretches, window);
            for (var k = 0; k < _leads; k++)
            {
                QualityStretches.AppendLead(_leadStretches[k], window, k);
            }
        }
    }
}
