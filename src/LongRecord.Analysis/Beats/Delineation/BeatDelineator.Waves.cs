namespace LongRecord.Analysis.Beats.Delineation;

// The P- and T-wave stages of the delineator, run once the QRS boundaries are known.
public sealed partial class BeatDelineator
{
    private int TEnd(int length, int fiducial, int onset, int offset, in DelineationContext context)
    {
        var limit = Math.Min(length - 2, fiducial + Samples(650));
        if (context.NextFiducial is int next && next > fiducial)
        {
            // Stop before the next beat's P wave.
            limit = Math.Min(limit, next - Math.Max(Samples(150), (int)(0.35 * (next - fiducial))));
        }

        // The QT interval is bounded by the heart rate (a QTc of 0.52 s by Bazett's formula, RR in seconds; from memory).
        var rr = context.NextFiducial is int n2 && n2 > fiducial ? n2 - fiducial
            : context.PreviousFiducial is int p2 && p2 < fiducial ? fiducial - p2 : Samples(1000);
        var t = _t with { MaxQt = Samples(1000 * _settings.TMaxQtcS * Math.Sqrt(Math.Clamp(rr / _fs, 0.3, 2.0))) };
        var best = -1;
        var bestAmplitude = 0f;
        var ends = _tEnds.AsSpan();
        var amplitudes = _tAmplitudes.AsSpan();
        for (var k = 0; k < ends.Length; k++)
        {
            ends[k] = -1;
            if (!_leadQrs[k].Usable)
            {
                continue;
            }

            ends[k] = TWaveEndSearch.Find(_waveSignal.AsSpan(k * length, length), _waveSlope.AsSpan(k * length, length), onset, offset, limit, t, out var a);
            amplitudes[k] = Math.Abs(a);
            bestAmplitude = Math.Max(bestAmplitude, ends[k] >= 0 ? amplitudes[k] : 0);
        }

        // The lead with the tallest T wave leads; another tall lead may extend the end a little (the latest end over
        // the clear leads, as QT practice takes it), never far.
        var tallest = -1;
        for (var k = 0; k < ends.Length; k++)
        {
            if (ends[k] >= 0 && amplitudes[k] >= _settings.TMinAmplitudeMv && (tallest < 0 || amplitudes[k] > amplitudes[tallest]))
            {
                tallest = k;
            }
        }

        if (tallest < 0)
        {
            return -1;
        }

        best = ends[tallest];
        var near = Samples(_settings.TLeadAgreementMs);
        for (var k = 0; k < ends.Length; k++)
        {
            if (ends[k] > best && ends[k] - ends[tallest] <= near && amplitudes[k] >= 0.5f * amplitudes[tallest])
            {
                best = ends[k];
            }
        }

        return best;
    }

    private (sbyte PWave, int PPeak) PWave(int length, int fiducial, int onset, in DelineationContext context)
    {
        // The window starts after the previous T wave: its measured end, or an estimate from the RR interval.
        var start = 0;
        if (context.PreviousFiducial is int prev && prev < fiducial)
        {
            start = _lastTEndAfterFiducial is int t
                ? prev + t + Samples(20)
                : prev + Math.Min((int)(0.6 * (fiducial - prev)), Samples(450));

            // A T end found late must not hide a P wave the beat-to-beat tests can still judge.
            start = Math.Min(start, onset - Samples(_settings.PMinWindowMs) - Math.Max(1, Samples(5)));
        }

        var judged = false;
        var best = -1;
        var bestRatio = 0f;
        for (var k = 0; k < _leads; k++)
        {
            ref var p = ref _leadP[k];
            p = default;
            p.Peak = -1;
            if (!_leadQrs[k].Usable)
            {
                continue;
            }

            var y = _waveSignal.AsSpan(k * length, length);
            p = _pSearch.Measure(k, y, start, onset, _scratch);
            if (!p.Judged)
            {
                continue;
            }

            judged = true;
            if (p.Accepted && p.Ratio > bestRatio)
            {
                bestRatio = p.Ratio;
                best = p.Peak;
            }
        }

        return !judged ? ((sbyte)-1, -1) : best >= 0 ? ((sbyte)1, best) : ((sbyte)0, -1);
    }
}
