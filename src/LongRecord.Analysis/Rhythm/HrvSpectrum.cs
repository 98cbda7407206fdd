using LongRecord.Analysis.Settings;
using NWaves.Transforms;

namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// LF and HF power of one short segment (Task Force 1996: 5 min, LF 0.04–0.15 Hz, HF 0.15–0.4 Hz, in ms²). The NN
/// series (value at the time of the beat that ends each interval) is interpolated by a natural cubic spline at
/// <c>ResampleHz</c> across the segment's NN span, its linear trend removed, Hann-windowed and transformed; the one-sided
/// periodogram is scaled so that it integrates to the windowed series' variance, and band power is its sum over the
/// band's bins times the bin width. VLF below 0.04 Hz is not given on 5-min segments (Task Force: unreliable).
/// One instance reuses its buffers from segment to segment.
/// </summary>
internal sealed class HrvSpectrum(HrvSettings settings)
{
    private readonly HrvSettings _s = settings;
    private double[] _second = [];
    private double[] _scratch = [];
    private double[] _series = [];
    private double[] _buffer = [];
    private double[] _re = [];
    private double[] _im = [];
    private RealFft64? _fft;

    public (double LfMs2, double HfMs2) Bands(ReadOnlySpan<double> tS, ReadOnlySpan<double> nnS)
    {
        var n = tS.Length;
        var fs = _s.ResampleHz;
        var points = n < 4 ? 0 : (int)Math.Floor((tS[n - 1] - tS[0]) * fs) + 1;
        if (points < 16)
        {
            return (double.NaN, double.NaN);
        }

        // A spline, not straight lines: linear interpolation low-passes the series (sinc² of f × RR: −23 % of power
        // at 0.25 Hz at 75 bpm).
        NaturalSpline(tS, nnS);
        Grow(ref _series, points);
        var j = 0;
        for (var k = 0; k < points; k++)
        {
            var t = tS[0] + k / fs;
            while (j < n - 2 && tS[j + 1] < t)
            {
                j++;
            }

            var h = tS[j + 1] - tS[j];
            var a = (tS[j + 1] - t) / h;
            var b = 1 - a;
            _series[k] = a * nnS[j] + b * nnS[j + 1] + ((a * a * a - a) * _second[j] + (b * b * b - b) * _second[j + 1]) * h * h / 6;
        }

        var series = _series.AsSpan(0, points);
        Detrend(series);
        var size = 1;
        while (size < points)
        {
            size <<= 1;
        }

        if (_fft is null || _fft.Size != size)
        {
            // A real-input transform with its twiddle tables built once per size (a 5-min segment at 4 Hz: 2048).
            _fft = new RealFft64(size);
            _buffer = new double[size];
            _re = new double[size];
            _im = new double[size];
        }

        var windowPower = 0.0;
        for (var k = 0; k < size; k++)
        {
            var w = k < points ? 0.5 - 0.5 * Math.Cos(2 * Math.PI * k / (points - 1)) : 0;
            windowPower += w * w;
            _buffer[k] = k < points ? series[k] * w : 0;
        }

        _fft.Direct(_buffer, _re, _im);
        var df = fs / size;
        double lf = 0, hf = 0;
        for (var k = 1; k < size / 2; k++)
        {
            var f = k * df;
            // One-sided density, s²/Hz: 2 |X|² / (fs Σw²).
            var density = 2 * (_re[k] * _re[k] + _im[k] * _im[k]) / (fs * windowPower);
            if (f >= _s.LfLowHz && f < _s.LfHighHz)
            {
                lf += density * df;
            }
            else if (f >= _s.LfHighHz && f < _s.HfHighHz)
            {
                hf += density * df;
            }
        }

        return (lf * 1e6, hf * 1e6);
    }

    // Second derivatives of the natural cubic spline through (t, y): tridiagonal system, ends held at zero.
    private void NaturalSpline(ReadOnlySpan<double> t, ReadOnlySpan<double> y)
    {
        var n = t.Length;
        Grow(ref _second, n);
        Grow(ref _scratch, n);
        var m = _second;
        var c = _scratch;
        m[0] = 0;
        c[0] = 0;
        for (var i = 1; i < n - 1; i++)
        {
            var h0 = t[i] - t[i - 1];
            var h1 = t[i + 1] - t[i];
            var rhs = 6 * ((y[i + 1] - y[i]) / h1 - (y[i] - y[i - 1]) / h0);
            var diag = 2 * (h0 + h1) - h0 * c[i - 1];
            c[i] = h1 / diag;
            m[i] = (rhs - h0 * m[i - 1]) / diag;
        }

        m[n - 1] = 0;
        for (var i = n - 2; i > 0; i--)
        {
            m[i] -= c[i] * m[i + 1];
        }
    }

    private static void Grow(ref double[] buffer, int length)
    {
        if (buffer.Length < length)
        {
            buffer = new double[Math.Max(length, 2 * buffer.Length)];
        }
    }

    private static void Detrend(Span<double> x)
    {
        var n = x.Length;
        double mt = (n - 1) / 2.0, mx = 0;
        foreach (var v in x)
        {
            mx += v;
        }

        mx /= n;
        double stt = 0, stx = 0;
        for (var k = 0; k < n; k++)
        {
            stt += (k - mt) * (k - mt);
            stx += (k - mt) * (x[k] - mx);
        }

        var slope = stx / stt;
        for (var k = 0; k < n; k++)
        {
            x[k] -= mx + slope * (k - mt);
        }
    }
}
