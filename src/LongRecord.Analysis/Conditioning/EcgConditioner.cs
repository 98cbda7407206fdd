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
    private readonly BiquadCascade _filter;
    private bool _started;
    private float _last;
    private bool[] _gaps = [];

    public EcgConditioner(double samplingRateHz, ConditioningSettings? settings = null)
    {
        settings ??= ConditioningSettings.Default;
        // One cascade (high-pass sections, then the notches) so all sections run in one loop over the samples.
        var sections = DesignFilter.TfToSos(new NWaves.Filters.Butterworth.HighPassFilter(settings.HighPassHz / samplingRateHz, 2).Tf).ToList();
        foreach (var mains in settings.MainsHz)
        {
            // A notch only makes sense well below the Nyquist frequency.
            if (mains < 0.45 * samplingRateHz)
            {
                sections.Add(DesignFilter.IirNotch(mains / samplingRateHz, settings.NotchQ));
            }
        }

        _filter = new BiquadCascade(sections);
    }

    /// <summary>Conditions <paramref name="signal"/> in place.</summary>
    public void Process(Span<float> signal)
    {
        var gaps = HoldGaps(signal);
        _filter.Process(signal);
        RestoreGaps(signal, gaps);
    }

    /// <summary>The filter cascade, for <see cref="LeadSetConditioner"/>, which runs several leads' cascades together.</summary>
    internal BiquadCascade Filter => _filter;

    /// <summary>
    /// Before filtering: settles the filter on the first block and holds the last valid value through gaps so the
    /// filters stay finite; returns where the gaps were (empty when there are none).
    /// </summary>
    internal ReadOnlySpan<bool> HoldGaps(Span<float> signal)
    {
        if (signal.IsEmpty)
        {
            return default;
        }

        if (!_started)
        {
            // The filter settles at the lead's first valid sample, whichever block holds it: a block of nothing but
            // gaps before it leaves the filter at rest (zeros in, zeros kept), so the output never depends on where
            // the caller's blocks begin.
            if (FirstValid(signal) is float first)
            {
                _last = first;
                _filter.SettleAt(first);
                _started = true;
            }
            else
            {
                _last = 0;
            }
        }

        if (!ContainsNaN(signal))
        {
            _last = signal[^1];
            return default;
        }

        if (_gaps.Length < signal.Length)
        {
            _gaps = new bool[signal.Length];
        }

        var gaps = _gaps.AsSpan(0, signal.Length);
        for (var i = 0; i < signal.Length; i++)
        {
            gaps[i] = float.IsNaN(signal[i]);
            if (gaps[i])
            {
                signal[i] = _last;
            }
            else
            {
                _last = signal[i];
            }
        }

        return gaps;
    }

    /// <summary>
    /// The gaps the last <see cref="HoldGaps"/> returned, given their length (zero when there were none), for a caller
    /// that holds several leads' gaps before filtering them together.
    /// </summary>
    internal ReadOnlySpan<bool> HeldGaps(int length) => _gaps.AsSpan(0, length);

    /// <summary>After filtering: missing samples become NaN again.</summary>
    internal static void RestoreGaps(Span<float> signal, ReadOnlySpan<bool> gaps)
    {
        for (var i = 0; i < gaps.Length; i++)
        {
            if (gaps[i])
            {
                signal[i] = float.NaN;
            }
        }
    }

    private static bool ContainsNaN(ReadOnlySpan<float> x)
    {
        var i = 0;
        if (System.Numerics.Vector.IsHardwareAccelerated)
        {
            var w = System.Numerics.Vector<float>.Count;
            var v = System.Runtime.InteropServices.MemoryMarshal.Cast<float, System.Numerics.Vector<float>>(x);
            foreach (var block in v)
            {
                // NaN is the only value unequal to itself.
                if (!System.Numerics.Vector.EqualsAll(block, block))
                {
                    return true;
                }
            }

            i = v.Length * w;
        }

        for (; i < x.Length; i++)
        {
            if (float.IsNaN(x[i]))
            {
                return true;
            }
        }

        return false;
    }

    private static float? FirstValid(ReadOnlySpan<float> x)
    {
        foreach (var v in x)
        {
            if (!float.IsNaN(v))
            {
                return v;
            }
        }

        return null;
    }
}
