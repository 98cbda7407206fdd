using System.Numerics;

namespace LongRecord.Analysis.Beats;

// The decision stage of the detector (Pan & Tompkins 1985): the leads' integrated signals fused, fiducial marks,
// adaptive thresholds, refractory period, T-wave discrimination and search-back.
public sealed partial class QrsDetector
{
    // Each lead's normalised integrated signal is clipped here so an artefact on one lead cannot outweigh the others
    // (our choice, no source).
    private const double LeadCap = 1.5;

    // Threshold I = NPKI + 0.3125 (SPKI − NPKI): Hamilton & Tompkins 1986's detection threshold coefficient (from memory).
    private const double ThresholdCoefficient = 0.3125;

    // How fast a lead's noise estimate rises when its noise grows (it falls at 1/8 per beat, the paper's level
    // update); our choice, no source.
    private const double NoiseAttack = 0.75;

    // The fiducial is sought over two integration windows before the integrated peak, so that broad and paced
    // complexes, whose energy comes late, still place it inside the complex (our measurement on MITDB).
    private const int FiducialWindows = 2;

    // Fuses the leads' integrated signals for samples _n onwards (at most `available` samples, FuseBatch, and no
    // further than the end of the ring) with the leads' current levels and weights.
    private void FuseAhead(int available)
    {
        var count = Math.Min(Math.Min(available, FuseBatch), _ring - _slot);
        FuseRange(_slot, count);
        _fusedUntil = _n + count;
    }

    // For each sample: Σ w_k min(LeadCap, (y_k / level_k)^0.75) / Σ w_k — each lead's integrated signal y_k scaled by
    // its QRS level, compressed, clipped so that an artefact on one lead cannot outweigh the others, and weighted by
    // the lead's quality. In single precision, as the integrated signal and the fused result are stored: the two
    // square roots and the division per sample and lead were the detector's largest cost in double. Vector lanes do
    // the scalar operations in the scalar order, so every value is the same either way.
    private void FuseRange(int slot, int count)
    {
        var fused = _fused.AsSpan(slot, count);
        var sums = _fuseSums.AsSpan(0, count);
        sums.Clear();
        double weightSum = 0;
        for (var k = 0; k < _leads; k++)
        {
            weightSum += _leadWeight[k];
            AddLead(_integrated[k].AsSpan(slot, count), (float)_leadLevel[k], (float)_leadWeight[k], sums);
        }

        var divisor = (float)weightSum;
        var i = 0;
        if (Vector.IsHardwareAccelerated)
        {
            var width = Vector<float>.Count;
            var divisors = new Vector<float>(divisor);
            for (; i + width <= count; i += width)
            {
                (new Vector<float>(sums[i..]) / divisors).CopyTo(fused[i..]);
            }
        }

        for (; i < count; i++)
        {
            fused[i] = sums[i] / divisor;
        }
    }

    private static void AddLead(ReadOnlySpan<float> integrated, float level, float weight, Span<float> sums)
    {
        var i = 0;
        if (Vector.IsHardwareAccelerated)
        {
            var width = Vector<float>.Count;
            var levels = new Vector<float>(level);
            var weights = new Vector<float>(weight);
            var cap = new Vector<float>((float)LeadCap);
            for (; i + width <= integrated.Length; i += width)
            {
                var a = new Vector<float>(integrated[i..]) / levels;
                // Compression x^0.75 = sqrt(x·sqrt(x)).
                a = Vector.Min(cap, Vector.SquareRoot(a * Vector.SquareRoot(a)));
                (new Vector<float>(sums[i..]) + weights * a).CopyTo(sums[i..]);
            }
        }

        for (; i < integrated.Length; i++)
        {
            var x = integrated[i] / level;
            sums[i] += weight * Math.Min((float)LeadCap, MathF.Sqrt(x * MathF.Sqrt(x)));
        }
    }

    private void Learn()
    {
        double fmax = 0;
        for (var k = 0; k < _leads; k++)
        {
            _leadLevel[k] = Math.Max(RingMax(_integrated[k], 0, _learnSamples - 1), 1e-12);
        }

        for (var i = 0; i < _learnSamples; i += FuseBatch)
        {
            FuseRange(i, Math.Min(FuseBatch, _learnSamples - i));
        }

        for (var i = 0; i < _learnSamples; i++)
        {
            fmax = Math.Max(fmax, _fused[i]);
        }

        _spk = 0.5 * fmax;
        _npk = 0.1 * fmax;
        _learned = true;

        // The learning period's own beats: judged once the levels exist.
        for (long m = 1; m + _peakHalfWidth < _learnSamples; m++)
        {
            if (IsLocalPeak((int)m))
            {
                CandidateAt(m, (int)m);
            }
        }
    }

    // A rise then no rise at slot ms: the quick test that most samples fail before the ±80 ms one.
    private bool IsLocalPeak(int ms)
    {
        var v = _fused[ms];
        return v > _fused[ms == 0 ? _ring - 1 : ms - 1] && v >= _fused[Next(ms)];
    }

    // A fiducial mark: the largest value of the integrated signal within ±80 ms (the earliest of equal values).
    private void CandidateAt(long m, int ms)
    {
        var fused = _fused;
        var v = fused[ms];
        var from = Math.Max(0, m - _peakHalfWidth);
        var slot = ms - (int)(m - from);
        slot = slot < 0 ? slot + _ring : slot;
        for (var j = from; j < m; j++)
        {
            if (fused[slot] >= v)
            {
                return;
            }

            slot = Next(slot);
        }

        slot = Next(slot);
        for (var j = m + 1; j <= m + _peakHalfWidth; j++)
        {
            if (fused[slot] > v)
            {
                return;
            }

            slot = Next(slot);
        }

        OnCandidate(new Candidate(m, v, MaxSlope(m)));
    }

    private double Threshold1 => _npk + ThresholdCoefficient * (_spk - _npk);

    private void OnCandidate(Candidate c)
    {
        if (_hasLast && c.Position - _last.Position <= _refractory)
        {
            // Within the refractory period only the larger of two marks can be a QRS (and only while the first is
            // still open).
            if (!_lastFinal && c.Value > _last.Value)
            {
                SetLast(c);
            }

            return;
        }

        if (c.Value > Threshold1)
        {
            if (_hasLast && c.Position - _last.Position < _tWaveLimit && c.Slope < 0.5 * _last.Slope)
            {
                Noise(c);
                return;
            }

            FinaliseLast();
            SetLast(c);
            _lastFinal = false;
            _sinceLast.Clear();
        }
        else
        {
            Noise(c);
        }
    }

    private void SetLast(Candidate c)
    {
        _last = c;
        _hasLast = true;
        UpdateSearchBackDue();
    }

    // Search-back is due when now − last ≥ 1.66 RR; for whole sample counts that is now − last ≥ ⌈1.66 RR⌉.
    private void UpdateSearchBackDue() =>
        _searchBackDue = _hasLast ? _last.Position + (long)Math.Ceiling(1.66 * _rrAverage) : long.MaxValue;

    private void Noise(Candidate c)
    {
        _noisePeaks[_noisePeakCount++ % History] = c.Value;
        _npk = Median(_noisePeaks, _noisePeakCount);
        _sinceLast.Add(c);
    }

    private void SearchBack(long now)
    {
        var last = _last;
        // Threshold II of the paper; it halves for every further two seconds without a beat so that the detector
        // recovers after an artefact has raised its levels.
        var overdueS = (now - last.Position - 1.66 * _rrAverage) / _fs;
        var threshold2 = 0.5 * Threshold1 * Math.Pow(0.5, Math.Max(0, overdueS - 1.0) / 2.0);
        var best = -1;
        for (var i = 0; i < _sinceLast.Count; i++)
        {
            var p = _sinceLast[i];
            var tWave = p.Position - last.Position < _tWaveLimit && p.Slope < 0.5 * last.Slope;
            if (!tWave && p.Position - last.Position > _refractory && p.Value > threshold2 && (best < 0 || p.Value > _sinceLast[best].Value))
            {
                best = i;
            }
        }

        if (best < 0)
        {
            return;
        }

        var found = _sinceLast[best];
        // The marks after the one found stay candidates, except those within its refractory period.
        var kept = 0;
        for (var i = best + 1; i < _sinceLast.Count; i++)
        {
            if (_sinceLast[i].Position - found.Position > _refractory)
            {
                _sinceLast[kept++] = _sinceLast[i];
            }
        }

        _sinceLast.RemoveRange(kept, _sinceLast.Count - kept);
        FinaliseLast();
        _qrsPeaks[_qrsPeakCount++ % History] = found.Value;
        _spk = Median(_qrsPeaks, _qrsPeakCount);
        SetLast(found);
        _lastFinal = true;
        Emit(found);
    }

    private void FinaliseLast()
    {
        if (_hasLast && !_lastFinal)
        {
            _qrsPeaks[_qrsPeakCount++ % History] = _last.Value;
            _spk = Median(_qrsPeaks, _qrsPeakCount);
            _lastFinal = true;
            Emit(_last);
        }
    }

    private void Emit(Candidate c)
    {
        if (_lastEmitted >= 0)
        {
            _rr[_rrCount++ % History] = c.Position - _lastEmitted;
            _rrAverage = Mean(_rr, _rrCount);
            UpdateSearchBackDue();
        }

        UpdateLeads(c.Position);
        _lastEmitted = c.Position;
        _output.Add(LocateFiducial(c.Position));
    }

    // Each lead's QRS level (its integrated peak at the beat) and noise (its largest integrated value between the
    // last two beats, relative to the level) set its scale and weight in the fusion from the next sample on.
    private void UpdateLeads(long pos)
    {
        for (var k = 0; k < _leads; k++)
        {
            double peak = RingMax(_integrated[k], Math.Max(0, pos - _window / 2), Math.Min(pos + _window / 2, _n - 1));
            // No further back than the rings hold behind a chunk the front end has already written ahead.
            var from = Math.Max(Math.Max(0, _lastEmitted + _refractory + _window), pos - _ring + _chunk + _peakHalfWidth + 1);
            double between = RingMax(_integrated[k], from, pos - _window - 1);
            _leadLevel[k] = 0.875 * _leadLevel[k] + 0.125 * Math.Max(peak, 1e-12);
            var noise = Math.Min(1.0, Math.Sqrt(between / _leadLevel[k]));
            var a = noise > _leadNoise[k] ? NoiseAttack : 0.125;
            _leadNoise[k] = (1 - a) * _leadNoise[k] + a * noise;
            var q = Math.Clamp(1.0 - _leadNoise[k], 0.02, 1.0);
            _leadWeight[k] = q * q;
        }

        _fusedUntil = _n + 1;
    }

    private double MaxSlope(long pos)
    {
        double best = 0;
        var from = Math.Max(pos - _window - _delay, (_hasLast ? _last.Position : -1) + 1);
        from = Math.Max(Math.Max(0, from), _n + _chunk - _ring + 1);
        for (var k = 0; k < _leads; k++)
        {
            double m = RingMax(_slope[k], from, pos);
            best = Math.Max(best, _leadWeight[k] * m / Math.Sqrt(_leadLevel[k]));
        }

        return best;
    }

    // The centre of the QRS slope energy across leads: robust for broad and paced complexes, where the largest
    // deflection can come late in the complex.
    private long LocateFiducial(long pos)
    {
        double sum = 0, moment = 0;
        var from = Math.Max(Math.Max(0, pos - FiducialWindows * _window - _delay), _n + _chunk - _ring + 1);
        var slot = SlotOf(from);
        for (var t = from; t <= pos; t++)
        {
            double e = 0;
            for (var k = 0; k < _leads; k++)
            {
                var v = _slope[k][slot];
                e += _leadWeight[k] * v * v / _leadLevel[k];
            }

            sum += e;
            moment += e * (t - from);
            slot = Next(slot);
        }

        var at = sum > 0 ? from + (long)Math.Round(moment / sum) : pos;
        return Math.Max(0, at - _delay);
    }

    // The largest of ring[t] for samples t = from … to (0 when the range is empty); NaN if any is NaN, as Math.Max.
    private float RingMax(float[] ring, long from, long to)
    {
        if (to < from)
        {
            return 0;
        }

        var start = SlotOf(from);
        var count = (int)(to - from + 1);
        var first = Math.Min(count, _ring - start);
        return Math.Max(SpanMax(ring.AsSpan(start, first)), SpanMax(ring.AsSpan(0, count - first)));
    }

    // Vector.Max and Math.Max agree (NaN wins, +0 above −0), so the order of the comparisons does not matter.
    private static float SpanMax(ReadOnlySpan<float> x)
    {
        var max = 0f;
        var i = 0;
        if (Vector.IsHardwareAccelerated && x.Length >= Vector<float>.Count)
        {
            var vmax = Vector<float>.Zero;
            for (; i + Vector<float>.Count <= x.Length; i += Vector<float>.Count)
            {
                vmax = Vector.Max(vmax, new Vector<float>(x[i..]));
            }

            for (var lane = 0; lane < Vector<float>.Count; lane++)
            {
                max = Math.Max(max, vmax[lane]);
            }
        }

        for (; i < x.Length; i++)
        {
            max = Math.Max(max, x[i]);
        }

        return max;
    }

    private static double Median(double[] values, int count)
    {
        var n = Math.Min(count, values.Length);
        Span<double> tmp = stackalloc double[n];
        values.AsSpan(0, n).CopyTo(tmp);
        return SmallSort.Median(tmp);
    }

    private static double Mean(double[] values, int count)
    {
        var n = Math.Min(count, values.Length);
        double s = 0;
        for (var i = 0; i < n; i++)
        {
            s += values[i];
        }

        return s / n;
    }

    private readonly record struct Candidate(long Position, double Value, double Slope);
}
