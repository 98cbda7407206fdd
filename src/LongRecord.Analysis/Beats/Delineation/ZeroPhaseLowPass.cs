using LongRecord.Analysis.Conditioning;

namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>
/// A Butterworth low-pass run forward and then backward over a short window (zero phase, so wave boundaries do not
/// move; the magnitude response is squared, −6 dB at the corner). Each call starts from the window's own edge value,
/// so no state passes between windows.
/// </summary>
internal sealed class ZeroPhaseLowPass
{
    private readonly BiquadCascade _filter;

    public ZeroPhaseLowPass(double cornerHz, double samplingRateHz, int order = 2)
    {
        // NWaves takes the corner divided by the sampling rate; keep it below Nyquist for slow recordings.
        var normalised = Math.Min(cornerHz, 0.45 * samplingRateHz) / samplingRateHz;
        _filter = new BiquadCascade(new NWaves.Filters.Butterworth.LowPassFilter(normalised, order).Tf);
    }

    /// <summary>Writes the filtered <paramref name="source"/> into <paramref name="destination"/> (same length).</summary>
    public void Apply(ReadOnlySpan<float> source, Span<float> destination)
    {
        source.CopyTo(destination);
        if (destination.IsEmpty)
        {
            return;
        }

        _filter.Reset();
        _filter.SettleAt(destination[0]);
        _filter.Process(destination);
        destination.Reverse();
        _filter.Reset();
        _filter.SettleAt(destination[0]);
        _filter.Process(destination);
        destination.Reverse();
    }
}
