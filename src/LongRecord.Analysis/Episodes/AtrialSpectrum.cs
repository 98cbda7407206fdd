using LongRecord.Analysis.Beats;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// The spectrum of atrial activity where no QRS–T complex is: the TQ windows between beats. Power is taken by a direct
/// Fourier sum over the kept samples of each 4 s segment (gaps allowed, each segment's mean removed), 3–12 Hz in
/// 0.1 Hz steps, averaged over segments and summed over leads (the gapped-window method of the synthesiser's own
/// flutter check).
/// A sharp peak near 4–6 Hz is flutter; a broad 4–9 Hz band fibrillatory waves (common practice).
/// For a regular rhythm every atrial wave at a whole multiple of the ventricular rate is locked to the QRS and an
/// average-beat subtraction would remove it (2:1 flutter): see <see cref="LockedAtrialWaves"/>.
/// </summary>
internal static class AtrialSpectrum
{
    public const double LowHz = 3, HighHz = 12, StepHz = 0.1;
    private const double SegmentS = 4;

    public static int Bins => (int)Math.Round((HighHz - LowHz) / StepHz) + 1;

    public static double Frequency(int bin) => LowHz + bin * StepHz;

    /// <summary>
    /// Spectrum of the TQ windows of beats first … last inside <paramref name="w"/>: from each beat's T end (the
    /// beats stage's, else 60 % of the RR up to 400 ms after R) + 20 ms to the next QRS onset (else 60 ms before the
    /// next R) − 20 ms, windows under 50 ms left out. Null when less than a fifth of each 4 s segment is left.
    /// </summary>
    public static double[]? Tq(SignalWindow w, BeatTrack t, int first, int last)
    {
        var fs = w.RateHz;
        var keep = new bool[w.Count];
        var margin = (int)Math.Round(0.02 * fs);
        var kept = 0;
        for (var i = Math.Max(first, 0); i < last; i++)
        {
            ref readonly var b = ref t[i];
            ref readonly var next = ref t[i + 1];
            var rr = next.Sample - b.Sample;
            var tEnd = b.TEndOffset != Beat.Unknown ? b.Sample + b.TEndOffset : b.Sample + (long)Math.Min(0.6 * rr, 0.4 * fs);
            var onset = next.QrsOnOffset != Beat.Unknown ? next.Sample + next.QrsOnOffset : next.Sample - (long)Math.Round(0.06 * fs);
            var from = tEnd + margin;
            var to = onset - margin;
            if (to - from < 0.05 * fs || !w.Holds(from, to))
            {
                continue;
            }

            for (var n = w.At(from); n <= w.At(to); n++)
            {
                keep[n] = true;
                kept++;
            }
        }

        if (kept < fs)
        {
            return null;
        }

        var spectrum = new double[Bins];
        var segments = 0;
        for (var lead = 0; lead < w.Leads; lead++)
        {
            var x = w.Lead(lead);
            var mask = new bool[w.Count];
            for (var n = 0; n < w.Count; n++)
            {
                mask[n] = keep[n] && !float.IsNaN(x[n]);
            }

            segments += Accumulate(x, mask, fs, spectrum);
        }

        return segments == 0 ? null : spectrum;
    }

    /// <summary>
    /// Sums the per-segment power of <paramref name="x"/> (kept samples only, each segment's mean removed) into
    /// <paramref name="spectrum"/>, averaged over the segments; returns the number of segments used.
    /// </summary>
    public static int Accumulate(ReadOnlySpan<float> x, ReadOnlySpan<bool> keep, double fs, double[] spectrum)
    {
        var length = (int)Math.Round(SegmentS * fs);
        var segmentPower = new double[spectrum.Length];
        var used = 0;
        for (var s0 = 0; s0 + length / 2 <= x.Length; s0 += length)
        {
            var s1 = Math.Min(x.Length, s0 + length);
            double mean = 0;
            var n = 0;
            for (var i = s0; i < s1; i++)
            {
                if (keep[i])
                {
                    mean += x[i];
                    n++;
                }
            }

            if (n < length / 5)
            {
                continue;
            }

            mean /= n;
            for (var b = 0; b < spectrum.Length; b++)
            {
                // Direct Fourier sum at one frequency, the phasor advanced by rotation.
                var omega = 2 * Math.PI * Frequency(b) / fs;
                double cr = Math.Cos(omega), ci = Math.Sin(omega);
                double pr = 1, pi = 0, re = 0, im = 0;
                for (var i = s0; i < s1; i++)
                {
                    if (keep[i])
                    {
                        var v = x[i] - mean;
                        re += v * pr;
                        im -= v * pi;
                    }

                    var npr = pr * cr - pi * ci;
                    pi = pr * ci + pi * cr;
                    pr = npr;
                }

                segmentPower[b] += (re * re + im * im) / n;
            }

            used++;
        }

        if (used > 0)
        {
            for (var b = 0; b < spectrum.Length; b++)
            {
                spectrum[b] += segmentPower[b] / used;
            }
        }

        return used;
    }

    /// <summary>Peak frequency, share of power within ± 0.3 Hz of it and share in 4–9 Hz, over 3–12 Hz.</summary>
    public static (double PeakHz, double PeakShare, double BandShare) Describe(double[] spectrum)
    {
        var total = spectrum.Sum();
        var peak = 0;
        for (var b = 1; b < spectrum.Length; b++)
        {
            if (spectrum[b] > spectrum[peak])
            {
                peak = b;
            }
        }

        double near = 0, band = 0;
        for (var b = 0; b < spectrum.Length; b++)
        {
            var f = Frequency(b);
            near += Math.Abs(f - Frequency(peak)) <= 0.3 + 1e-9 ? spectrum[b] : 0;
            band += f >= 4 - 1e-9 && f <= 9 + 1e-9 ? spectrum[b] : 0;
        }

        return total > 0 ? (Frequency(peak), near / total, band / total) : (double.NaN, double.NaN, double.NaN);
    }
}
