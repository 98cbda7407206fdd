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
