using System.Runtime.Intrinsics;
using System.Runtime.Intrinsics.X86;
using LongRecord.Analysis.Numerics;

namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>
/// The P-wave stage: in the PR window before the QRS onset, on a lead low-passed for slow waves, the largest
/// deflection from the local baseline is the P-wave candidate. A P wave is reported only when the candidate is a
/// single rounded wave of plausible width, stands well above the rest of the window (fibrillatory and flutter waves
/// fill it), and repeats from beat to beat: its stretch of signal correlates with the same stretch before the QRS of
/// the recent beats, and its distance to the QRS agrees with theirs (atrial activity in AF bears no fixed relation
/// to the QRS). Laguna et al. (1994) place the P search window relative to the QRS; the activity and consistency
/// tests are ours.
/// </summary>
internal sealed class PWaveSearch
{
    private readonly PWaveSamples _p;
    private readonly float[][] _history;   // per lead: History windows of TemplateLength samples, aligned to the QRS onset
    private readonly int[][] _historyStart; // per lead: first valid sample of each stored window (0 = whole window valid)
    private readonly int[][] _historyPr;    // per lead: the stored beats' candidate distance to the QRS onset, samples (−1 = none)
    private readonly int[] _historyCount;
    private readonly float[] _correlations;
    private readonly int[] _lagOffsets;
    private float[] _residual = [];

    public PWaveSearch(int leads, in PWaveSamples p)
    {
        _p = p;
        _history = new float[leads][];
        _historyStart = new int[leads][];
        _historyPr = new int[leads][];
        _historyCount = new int[leads];
        for (var k = 0; k < leads; k++)
        {
            _history[k] = new float[p.History * p.TemplateLength];
            _historyStart[k] = new int[p.History];
            _historyPr[k] = new int[p.History];
        }

        _correlations = new float[p.History];
        _lagOffsets = new int[2 * p.MaxLag / Math.Max(1, p.CorrelationStep) + 2];
    }

    /// <summary>
    /// Measures lead <paramref name="lead"/>: <paramref name="y"/> is the slow-wave signal of the window,
    /// <paramref name="start"/> the first sample the P window may use (after the previous T wave), <paramref name="qrsOnset"/>
    /// the multilead QRS onset. The beat is added to the lead's history.
    /// </summary>
    public LeadP Measure(int lead, ReadOnlySpan<float> y, int start, int qrsOnset, Span<float> scratch)
    {
        var result = new LeadP { Peak = -1, Correlation = float.NaN, PrAgreement = float.NaN };
        var end = qrsOnset - _p.EndGap;
        var begin = Math.Max(Math.Max(start, 0), qrsOnset - _p.Window);
        if (end - begin < _p.MinWindow)
        {
            return result;
        }

        result.Judged = true;

        // Baseline: the straight line through the medians of the two ends of the window.
        var left = MedianOf(y.Slice(begin, _p.Edge), scratch);
        var right = MedianOf(y.Slice(end - _p.Edge, _p.Edge), scratch);
        var baseline = new Line(left, (right - left) / Math.Max(1, end - _p.Edge / 2 - (begin + _p.Edge / 2)), begin + _p.Edge / 2);

        // The signal less the baseline, once, for every test below and for the history.
        if (_residual.Length < y.Length)
        {
            _residual = new float[y.Length];
        }

        var r = _residual.AsSpan(0, y.Length);
        SubtractLine(y[begin..qrsOnset], r[begin..qrsOnset], baseline, begin);

        // The candidate: the largest local extremum that is a whole wave inside the window (it falls to half its
        // height on both sides), so the tail of the previous T wave at the window's start is not taken for a P wave.
        var peakFrom = Math.Max(begin + 1, qrsOnset - _p.PeakEarliest);
        var peakTo = Math.Min(end - 2, qrsOnset - _p.PeakLatest);
        var at = -1;
        var best = 0f;
        for (var i = peakFrom; i <= peakTo; i++)
        {
            var v = r[i];
            var size = Math.Abs(v);
            if (size <= best || size < Math.Abs(r[i - 1]) || size < Math.Abs(r[i + 1]))
            {
                continue;
            }

            if (WholeWave(r, begin, end, i))
            {
                best = size;
                at = i;
            }
        }

        if (at >= 0)
        {
            Describe(r, begin, end, at, ref result);
            Judge(lead, y, begin, qrsOnset, at, ref result);
        }

        Remember(lead, r, begin, qrsOnset, at);
        return result;
    }

    // A P wave: a plausible, isolated wave that repeats from beat to beat (no history yet counts as repeating). The
    // tests run cheapest first; the shape correlation only when the others pass.
    private void Judge(int lead, ReadOnlySpan<float> y, int begin, int qrsOnset, int at, ref LeadP result)
    {
        var g = _p.Gate;
        var plausible = Math.Abs(result.Amplitude) >= g.MinAmplitude && result.HalfWidth >= g.MinHalfWidth && result.HalfWidth <= g.MaxHalfWidth;
        var isolated = result.Ratio >= g.Ratio && result.PeakRatio >= g.PeakRatio;
        if (!plausible || !isolated)
        {
            return;
        }

        var count = Math.Min(_historyCount[lead], _p.History);
        if (count > 0)
        {
            var agree = 0;
            var pr = qrsOnset - at;
            for (var j = 0; j < count; j++)
            {
                if (_historyPr[lead][j] >= 0 && Math.Abs(_historyPr[lead][j] - pr) <= _p.PrTolerance)
                {
                    agree++;
                }
            }

            result.PrAgreement = (float)agree / count;
            if (result.PrAgreement < g.PrAgreement)
            {
                return;
            }

            result.Correlation = Correlation(lead, y, begin, qrsOnset, at, count, g.Correlation);
            if (result.Correlation < g.Correlation)
            {
                return;
            }
        }

        result.Accepted = true;
    }

    private static bool WholeWave(ReadOnlySpan<float> r, int begin, int end, int at)
    {
        var v = r[at];
        var sign = Math.Sign(v);
        var half = 0.5f * Math.Abs(v);
        var lo = at;
        while (lo > begin && sign * r[lo] > half)
        {
            lo--;
        }

        var hi = at;
        while (hi < end - 1 && sign * r[hi] > half)
        {
            hi++;
        }

        return sign * r[lo] <= half && sign * r[hi] <= half;
    }

    private void Describe(ReadOnlySpan<float> r, int begin, int end, int at, ref LeadP result)
    {
        var amplitude = r[at];
        var sign = Math.Sign(amplitude);
        var size = Math.Abs(amplitude);

        // Extent of the wave: out from the peak while it keeps its sign and stays above 20 % of the peak.
        int lo = at, hi = at, halfLo = at, halfHi = at;
        while (lo > begin && sign * r[lo - 1] > 0.2f * size)
        {
            lo--;
            if (sign * r[lo] >= 0.5f * size)
            {
                halfLo = lo;
            }
        }

        while (hi < end - 1 && sign * r[hi + 1] > 0.2f * size)
        {
            hi++;
            if (sign * r[hi] >= 0.5f * size)
            {
                halfHi = hi;
            }
        }

        // The rest of the window, outside the wave and a margin: its RMS and its largest deflection (the stretch before
        // the wave, then the one after it, each in order).
        double sum = 0;
        var largest = 0f;
        var waveFrom = Math.Max(begin, lo - _p.Margin);
        var waveTo = Math.Max(begin, Math.Min(end, hi + _p.Margin + 1));
        AddRest(r[begin..waveFrom], ref sum, ref largest);
        AddRest(r[waveTo..end], ref sum, ref largest);
        var n = (waveFrom - begin) + (end - waveTo);

        result.Peak = at;
        result.Amplitude = amplitude;
        result.HalfWidth = halfHi - halfLo + 1;
        result.RestSamples = n;
        result.Activity = n > 0 ? (float)Math.Sqrt(sum / n) : 0f;
        result.RestLargest = largest;
    }

    // Sum of squares and largest magnitude of a stretch, added in order.
    private static void AddRest(ReadOnlySpan<float> stretch, ref double sum, ref float largest)
    {
        foreach (var v in stretch)
        {
            sum += v * v;
            largest = Math.Max(largest, Math.Abs(v));
        }
    }

    // Median over the stored beats of the best correlation (over a small lag) between the candidate's stretch and the
    // same stretch, relative to the QRS onset, of the stored beat.
    private float Correlation(int lead, ReadOnlySpan<float> y, int begin, int qrsOnset, int at, int count, float gate)
    {
        var windowStart = qrsOnset - _p.TemplateLength;

        // Only the P window's own stretch: the QRS onset or the previous T wave would correlate in any rhythm.
        var a = Math.Max(begin, at - _p.CorrelationHalf);
        var b = Math.Min(qrsOnset - _p.EndGap - 1, at + _p.CorrelationHalf);
        var n = b - a + 1;
        if (n < 3 * _p.CorrelationStep)
        {
            return float.NaN;
        }

        // The slow-wave signal is sampled every `step` samples (about 8 ms): enough for a 15 Hz band, and the cost no
        // longer grows with the sampling rate.
        var step = _p.CorrelationStep;
        var m = (n + step - 1) / step;
        float sy = 0, syy = 0;
        for (var i = a; i <= b; i += step)
        {
            sy += y[i];
            syy += y[i] * y[i];
        }

        var varY = syy - sy * sy / m;
        var offsets = _lagOffsets.AsSpan();
        var used = 0;
        var passed = 0;
        for (var j = 0; j < count; j++)
        {
            var stored = _history[lead].AsSpan(j * _p.TemplateLength, _p.TemplateLength);
            var validFrom = _historyStart[lead][j];
            // The lags that fit the stored window, in increasing order; their sums run side by side, four at a time
            // (each lane adds its products in the order one lag alone would, so the figures are the same).
            var lags = 0;
            for (var lag = -_p.MaxLag; lag <= _p.MaxLag; lag += step)
            {
                var sa = a - windowStart + lag;
                if (sa >= validFrom && sa + n <= _p.TemplateLength)
                {
                    offsets[lags++] = sa;
                }
            }

            var bestR = float.NaN;
            for (var g = 0; g < lags; g += 4)
            {
                var o0 = offsets[g];
                var o1 = g + 1 < lags ? offsets[g + 1] : o0;
                var o2 = g + 2 < lags ? offsets[g + 2] : o0;
                var o3 = g + 3 < lags ? offsets[g + 3] : o0;
                var sx = Vector128<float>.Zero;
                var sxx = Vector128<float>.Zero;
                var sxy = Vector128<float>.Zero;

                // Four lags one step apart read stored[o0 + t + k·step]: for steps of one and two samples (up to
                // 250 Hz) these come from one or two loads instead of four.
                var evenlySpaced = g + 3 < lags && o1 == o0 + step && o2 == o0 + 2 * step && o3 == o0 + 3 * step;
                if (evenlySpaced && step == 1)
                {
                    for (int i = a, t = o0; i <= b; i += step, t += step)
                    {
                        var u = Vector128.Create(stored.Slice(t, 4));
                        sx += u;
                        sxx += u * u;
                        sxy += u * Vector128.Create(y[i]);
                    }
                }
                else if (evenlySpaced && step == 2 && Sse.IsSupported)
                {
                    for (int i = a, t = o0; i <= b; i += step, t += step)
                    {
                        // Elements 0 and 2 of stored[t..t+3] and 1 and 3 of stored[t+3..t+6]: t, t+2, t+4, t+6.
                        var u = Sse.Shuffle(Vector128.Create(stored.Slice(t, 4)), Vector128.Create(stored.Slice(t + 3, 4)), 0b11_01_10_00);
                        sx += u;
                        sxx += u * u;
                        sxy += u * Vector128.Create(y[i]);
                    }
                }
                else
                {
                    for (int i = a, t = 0; i <= b; i += step, t += step)
                    {
                        var u = Vector128.Create(stored[o0 + t], stored[o1 + t], stored[o2 + t], stored[o3 + t]);
                        sx += u;
                        sxx += u * u;
                        sxy += u * Vector128.Create(y[i]);
                    }
                }

                for (var l = 0; l < 4 && g + l < lags; l++)
                {
                    float x1 = sx.GetElement(l), x2 = sxx.GetElement(l), xy = sxy.GetElement(l);
                    var den = MathF.Sqrt(Math.Max(0, x2 - x1 * x1 / m) * Math.Max(0, varY));
                    var r = den > 0 ? (xy - x1 * sy / m) / den : 0f;
                    if (float.IsNaN(bestR) || r > bestR)
                    {
                        bestR = r;
                    }
                }
            }

            if (!float.IsNaN(bestR))
            {
                _correlations[used++] = bestR;
                passed += bestR >= gate ? 1 : 0;
            }

            // The test is the median (element used ÷ 2 in ascending order) against the gate: it passes when at least
            // ⌈used ÷ 2⌉ correlations reach the gate. Once the beats left cannot change that either way, the answer is
            // known, and the median itself is not needed (only the test's outcome is used): the gate is returned for
            // a pass, and the median so far for a fail.
            var left = count - j - 1;
            var most = used + left;
            if (passed >= most - most / 2)
            {
                return gate;
            }

            if (passed + left < most - most / 2)
            {
                return Selection.Median(_correlations.AsSpan(0, used));
            }
        }

        return used > 0 ? Selection.Median(_correlations.AsSpan(0, used)) : float.NaN;
    }

    private void Remember(int lead, ReadOnlySpan<float> r, int begin, int qrsOnset, int at)
    {
        var slot = _historyCount[lead] % _p.History;
        var stored = _history[lead].AsSpan(slot * _p.TemplateLength, _p.TemplateLength);
        var windowStart = qrsOnset - _p.TemplateLength;
        var validFrom = Math.Max(0, begin - windowStart);
        // Zero before the first valid sample (and before the signal's start), the residual from there on.
        var from = Math.Min(stored.Length, Math.Max(validFrom, -windowStart));
        stored[..from].Clear();
        r.Slice(windowStart + from, stored.Length - from).CopyTo(stored[from..]);

        _historyStart[lead][slot] = validFrom;
        _historyPr[lead][slot] = at >= 0 ? qrsOnset - at : -1;
        _historyCount[lead]++;
    }

    // r[i] = y[i] − line.At(first + i), eight samples at a time: each lane does the scalar operations in the scalar
    // order (the index converted to float, times the slope, plus the level, subtracted), so the values are the same.
    private static void SubtractLine(ReadOnlySpan<float> y, Span<float> r, Line line, int first)
    {
        var i = 0;
        if (Vector256.IsHardwareAccelerated)
        {
            var level = Vector256.Create(line.Level);
            var slope = Vector256.Create(line.Slope);
            var index = Vector256.Create(first - line.Origin) + Vector256<int>.Indices;
            for (; i + 8 <= y.Length; i += 8)
            {
                var at = level + slope * Vector256.ConvertToSingle(index);
                (Vector256.Create(y.Slice(i, 8)) - at).CopyTo(r.Slice(i, 8));
                index += Vector256.Create(8);
            }
        }

        for (; i < y.Length; i++)
        {
            r[i] = y[i] - line.At(first + i);
        }
    }

    private static float MedianOf(ReadOnlySpan<float> values, Span<float> scratch)
    {
        var s = scratch[..values.Length];
        values.CopyTo(s);
        return Selection.Median(s);
    }

    private readonly record struct Line(float Level, float Slope, int Origin)
    {
        public float At(int i) => Level + Slope * (i - Origin);
    }
}

/// <summary>What the P-wave stage measured on one lead.</summary>
internal struct LeadP
{
    public bool Judged;
    public int Peak;
    public float Amplitude;
    public int HalfWidth;
    public int RestSamples;
    public float Activity;
    public float RestLargest;

    /// <summary>
    /// Median correlation of the candidate's stretch with the same stretch of the recent beats (NaN: no history); when the
    /// stored beats decided the test against the gate before all were compared, the gate itself (a pass) or the median so
    /// far (a fail).
    /// </summary>
    public float Correlation;

    /// <summary>Share of the recent beats whose candidate lay at the same distance before the QRS (NaN: no history).</summary>
    public float PrAgreement;

    public bool Accepted;

    public readonly float Ratio => Activity > 0 ? Math.Abs(Amplitude) / Activity : float.PositiveInfinity;

    public readonly float PeakRatio => RestLargest > 0 ? Math.Abs(Amplitude) / RestLargest : float.PositiveInfinity;
}

/// <summary>P-wave settings in samples for one sampling rate.</summary>
internal readonly record struct PWaveSamples(
    int Window, int EndGap, int MinWindow, int Edge, int PeakEarliest, int PeakLatest, int Margin,
    int TemplateLength, int History, int CorrelationHalf, int MaxLag, int PrTolerance, PWaveGate Gate, int CorrelationStep = 1);

/// <summary>The P-wave decision thresholds (amplitude in mV, widths in samples).</summary>
internal readonly record struct PWaveGate(
    float MinAmplitude, int MinHalfWidth, int MaxHalfWidth, float Ratio, float PeakRatio, float PrAgreement, float Correlation);
