using NWaves.Filters.Fda;

namespace LongRecord.Analysis.Conditioning;

/// <summary>
/// Streaming conditioning of one lead: baseline-wander removal (second-order Butterworth high-pass at 0.5 Hz, the
/// lower corner that AHA recommendations give for diagnostic ECG — from memory) and mains-interference notches at 50 and
/// 60 Hz (both: recorders do not say which mains they met). Causal, with the filter state carried between blocks, so
/// any block size gives the same samples. Missing samples (NaN) hold the last value through the filters and stay NaN
/// in the output.
/// </summary>
public sealed class EcgConditioner
{
    private readonly BiquadCascade _highPass;
    private readonly BiquadCascade[] _notches;
    private bool _started;
    private float _last;

    public EcgConditioner(double samplingRateHz, ConditioningSettings? settings = null)
    {
        settings ??= ConditioningSettings.Default;
        _highPass = new BiquadCascade(new NWaves.Filters.Butterworth.HighPassFilter(settings.HighPassHz / samplingRateHz, 2).Tf);
        var notches = new List<BiquadCascade>();
        foreach (var mains in settings.MainsHz)
        {
            // A notch only makes sense well below the Nyquist frequency.
            if (mains < 0.45 * samplingRateHz)
            {
                notches.Add(new BiquadCascade([DesignFilter.IirNotch(mains / samplingRateHz, settings.NotchQ)]));
            }
        }

        _notches = notches.ToArray();
    }

    /// <summary>Conditions <paramref name="signal"/> in place.</summary>
    public void Process(Span<float> signal)
    {
        if (signal.IsEmpty)
        {
            return;
        }

        if (!_started)
        {
            var first = FirstValid(signal);
            _last = first;
            _highPass.SettleAt(first);
            foreach (var n in _notches)
            {
                n.SettleAt(0);
            }

            _started = true;
        }

        // Hold the last valid value through gaps so the filters stay finite; restore NaN afterwards.
        bool[]? gap = null;
        for (var i = 0; i < signal.Length; i++)
        {
            if (float.IsNaN(signal[i]))
            {
                gap ??= new bool[signal.Length];
                gap[i] = true;
                signal[i] = _last;
            }
            else
            {
                _last = signal[i];
            }
        }

        _highPass.Process(signal);
        foreach (var n in _notches)
        {
            n.Process(signal);
        }

        if (gap is not null)
        {
            for (var i = 0; i < signal.Length; i++)
            {
                if (gap[i])
                {
                    signal[i] = float.NaN;
                }
            }
        }
    }

    private static float FirstValid(ReadOnlySpan<float> x)
    {
        foreach (var v in x)
        {
            if (!float.IsNaN(v))
            {
                return v;
            }
        }

        return 0;
    }
}
