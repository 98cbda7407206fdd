using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using LongRecord.Analysis.Numerics;

namespace LongRecord.Analysis.Beats.Delineation;

// Signal helpers of the delineator: QRS location, noise level, dominant deflection, derivative, buffers.
public sealed partial class BeatDelineator
{
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

    private (float Activity, float Noise) NoiseSlope(ReadOnlySpan<float> d, ReadOnlySpan<float> slow, int centre)
    {
        // What the lead shows away from this beat's QRS, from short segments' mean absolute slopes. The activity is a
        // quantile of the segments, not a mean over everything outside this beat: at fast rates the neighbouring
        // complexes fill the window, and a mean reads them as activity (a broad tachycardia at 170 bpm then had its
        // boundary thresholds raised to a quarter of the QRS's steepest slope and measured 95 ms for 162). The noise
        // is the same for the slope the 25 Hz band holds beyond the 15 Hz band: P, T and fibrillatory waves hardly
        // reach it, so it is the lead's own noise, for its SNR.
        var segment = Math.Max(2, Samples(_settings.NoiseSegmentMs));
        var exclude = Samples(_settings.NoiseExclusionMs);
        var half = _scratch.Length / 2;
        var activity = _scratch.AsSpan(0, half);
        var noise = _scratch.AsSpan(half, half);
        // The segments' starts first, then their sums four segments at a time: each sum still adds its samples in
        // order, but the four run side by side instead of waiting on one another.
        var starts = _segmentStarts.AsSpan();
        var count = 0;
        for (var a = 0; a + segment <= d.Length && count < half && count < starts.Length; a += segment)
        {
            if (a + segment <= centre - exclude || a >= centre + exclude)
            {
                starts[count++] = a;
            }
        }

        var s = 0;
        for (; s + 4 <= count; s += 4)
        {
            int p0 = starts[s], p1 = starts[s + 1], p2 = starts[s + 2], p3 = starts[s + 3];
            float sum0 = 0f, sum1 = 0f, sum2 = 0f, sum3 = 0f;
            float high0 = 0f, high1 = 0f, high2 = 0f, high3 = 0f;
            // The slices check the segments' bounds once; the loop then reads without a check per sample.
            ref var d0 = ref MemoryMarshal.GetReference(d.Slice(p0, segment));
            ref var d1 = ref MemoryMarshal.GetReference(d.Slice(p1, segment));
            ref var d2 = ref MemoryMarshal.GetReference(d.Slice(p2, segment));
            ref var d3 = ref MemoryMarshal.GetReference(d.Slice(p3, segment));
            ref var w0 = ref MemoryMarshal.GetReference(slow.Slice(p0, segment));
            ref var w1 = ref MemoryMarshal.GetReference(slow.Slice(p1, segment));
            ref var w2 = ref MemoryMarshal.GetReference(slow.Slice(p2, segment));
            ref var w3 = ref MemoryMarshal.GetReference(slow.Slice(p3, segment));
            for (nint i = 0; i < segment; i++)
            {
                float x0 = Unsafe.Add(ref d0, i), x1 = Unsafe.Add(ref d1, i), x2 = Unsafe.Add(ref d2, i), x3 = Unsafe.Add(ref d3, i);
                sum0 += Math.Abs(x0);
                high0 += Math.Abs(x0 - Unsafe.Add(ref w0, i));
                sum1 += Math.Abs(x1);
                high1 += Math.Abs(x1 - Unsafe.Add(ref w1, i));
                sum2 += Math.Abs(x2);
                high2 += Math.Abs(x2 - Unsafe.Add(ref w2, i));
                sum3 += Math.Abs(x3);
                high3 += Math.Abs(x3 - Unsafe.Add(ref w3, i));
            }

            activity[s] = sum0 / segment;
            noise[s] = high0 / segment;
            activity[s + 1] = sum1 / segment;
            noise[s + 1] = high1 / segment;
            activity[s + 2] = sum2 / segment;
            noise[s + 2] = high2 / segment;
            activity[s + 3] = sum3 / segment;
            noise[s + 3] = high3 / segment;
        }

        for (; s < count; s++)
        {
            var a = starts[s];
            var sum = 0f;
            var sumHigh = 0f;
            for (var i = a; i < a + segment; i++)
            {
                sum += Math.Abs(d[i]);
                sumHigh += Math.Abs(d[i] - slow[i]);
            }

            activity[s] = sum / segment;
            noise[s] = sumHigh / segment;
        }

        if (count == 0)
        {
            return (0f, 0f);
        }

        var a1 = Selection.Nth(activity[..count], (int)(_settings.ActivityQuantile * (count - 1)));
        var n1 = Selection.Nth(noise[..count], (int)(_settings.NoiseQuantile * (count - 1)));
        return ((float)(_settings.ActivityScale * a1), (float)(_settings.NoiseScale * n1));
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

    private void Differentiate(ReadOnlySpan<float> x, Span<float> d)
    {
        // Central difference in mV/s, so slope thresholds do not depend on the sampling rate. Each output is one
        // subtraction and one product, so the vector loop gives the scalar loop's values exactly.
        var scale = (float)(_fs / 2);
        var n = x.Length;
        var i = 1;
        if (Vector.IsHardwareAccelerated)
        {
            var w = Vector<float>.Count;
            var s = new Vector<float>(scale);
            for (; i + w < n; i += w)
            {
                var ahead = new Vector<float>(x.Slice(i + 1, w));
                var behind = new Vector<float>(x.Slice(i - 1, w));
                ((ahead - behind) * s).CopyTo(d.Slice(i, w));
            }
        }

        for (; i < n - 1; i++)
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
        _segmentStarts = new int[length];
        _energy = new float[length];
        _work = new double[4 * length];
    }

    private int Samples(double ms) => (int)Math.Round(ms * _fs / 1000.0);
}
