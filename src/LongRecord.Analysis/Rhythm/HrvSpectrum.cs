using System.Numerics;
using LongRecord.Analysis.Settings;
using MathNet.Numerics.IntegralTransforms;
using MathNet.Numerics.Interpolation;

namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// LF and HF power of one short segment (Task Force 1996: 5 min, LF 0.04–0.15 Hz, HF 0.15–0.4 Hz, in ms²). The NN
/// series (value at the time of the beat that ends each interval) is interpolated by a natural cubic spline at <c>ResampleHz</c>
/// across the segment's NN span, its linear trend removed, Hann-windowed and transformed; the one-sided periodogram
/// is scaled so that it integrates to the windowed series' variance, and band power is its sum over the band's bins
/// times the bin width. Power is therefore that of the segment's NN variations in each band; VLF below 0.04 Hz is
/// not given on 5-min segments (Task Force: unreliable).
/// </summary>
internal static class HrvSpectrum
{
    public static (double LfMs2, double HfMs2) Bands(ReadOnlySpan<double> tS, ReadOnlySpan<double> nnS, HrvSettings s)
    {
        var n = tS.Length;
        if (n < 4)
        {
            return (double.NaN, double.NaN);
        }

        var fs = s.ResampleHz;
        var points = (int)Math.Floor((tS[n - 1] - tS[0]) * fs) + 1;
        if (points < 16)
        {
            return (double.NaN, double.NaN);
        }

        // Natural cubic spline through the NN values: linear interpolation would low-pass the series (sinc² of
        // f × RR: −23 % of power at 0.25 Hz at 75 bpm), a spline keeps the HF band.
        var spline = CubicSpline.InterpolateNaturalSorted(tS.ToArray(), nnS.ToArray());
        var series = new double[points];
        for (var k = 0; k < points; k++)
        {
            series[k] = spline.Interpolate(tS[0] + k / fs);
        }

        Detrend(series);
        var size = 1;
        while (size < points)
        {
            size <<= 1;
        }

        var buffer = new Complex[size];
        var windowPower = 0.0;
        for (var k = 0; k < points; k++)
        {
            var w = 0.5 - 0.5 * Math.Cos(2 * Math.PI * k / (points - 1));
            windowPower += w * w;
            buffer[k] = new Complex(series[k] * w, 0);
        }

        Fourier.Forward(buffer, FourierOptions.NoScaling);
        var df = fs / size;
        double lf = 0, hf = 0;
        for (var k = 1; k < size / 2; k++)
        {
            var f = k * df;
            // One-sided density, s²/Hz: 2 |X|² / (fs Σw²).
            var density = 2 * buffer[k].Magnitude * buffer[k].Magnitude / (fs * windowPower);
            if (f >= s.LfLowHz && f < s.LfHighHz)
            {
                lf += density * df;
            }
            else if (f >= s.LfHighHz && f < s.HfHighHz)
            {
                hf += density * df;
            }
        }

        return (lf * 1e6, hf * 1e6);
    }

    private static void Detrend(double[] x)
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
