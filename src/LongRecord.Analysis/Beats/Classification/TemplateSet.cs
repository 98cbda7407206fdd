using System.Numerics;

namespace LongRecord.Analysis.Beats.Classification;

/// <summary>
/// Online clustering of QRS shapes for one recording. A beat joins the template it correlates best with (Pearson
/// correlation over all leads together, at the best of small shifts) when the correlation and the amplitude ratio
/// are close enough; otherwise it starts a new template. Templates are running means; two that become alike merge;
/// when the set is full the lightest template gives way. The normal template is the heaviest by on-time beats.
/// </summary>
internal sealed class TemplateSet
{
    private readonly int _leads;
    private readonly int _segment;
    private readonly ClassificationSettings _settings;
    private readonly MorphologyTemplate[] _templates;

    // The two templates' versions when a pair of slots was last compared for merging: an unchanged pair compares the
    // same, and was not merged then.
    private readonly long[,] _comparedA;
    private readonly long[,] _comparedB;
    private long _versions;
    private readonly double _decay;
    private short _nextId;
    private long _beats;

    public TemplateSet(int leads, int segment, int atrial, ClassificationSettings settings)
    {
        _leads = leads;
        _segment = segment;
        _settings = settings;
        _templates = new MorphologyTemplate[settings.MaxTemplates];
        for (var i = 0; i < _templates.Length; i++)
        {
            _templates[i] = new MorphologyTemplate(leads, segment, atrial);
        }

        _comparedA = new long[_templates.Length, _templates.Length];
        _comparedB = new long[_templates.Length, _templates.Length];

        // Weights halve over this many beats: old clusters fade so the set follows a recording that changes.
        _decay = Math.Pow(0.5, 1.0 / settings.TemplateHalfLifeBeats);
    }

    public MorphologyTemplate? Normal { get; private set; }

    public IReadOnlyList<MorphologyTemplate> All => _templates;

    /// <summary>
    /// Assigns the beat to a template (creating one when none fits) and updates it. Correlations and amplitude ratios
    /// are judged after <paramref name="noiseCorrection"/> (<see cref="NoiseFloor.Correction"/>; 1 for a clean beat);
    /// the match carries the beat's raw residual energy against the closest existing template (NaN when there was none).
    /// </summary>
    public Match Assign(BeatShape beat, bool onTime, double widthMs, double noiseCorrection = 1)
    {
        _beats++;
        foreach (var t in _templates)
        {
            if (t.InUse)
            {
                t.Decay(_decay);
            }
        }

        MorphologyTemplate? best = null;
        double bestCorr = -2, bestAmp = 0;
        var bestShift = 0;
        Span<double> coarse = stackalloc double[_templates.Length];
        for (var i = 0; i < _templates.Length; i++)
        {
            coarse[i] = _templates[i].InUse ? Correlate(beat, _templates[i], 0, out _) : -2;
        }

        // Fine search over shifts only for the few templates that are close at zero shift.
        for (var pick = 0; pick < 2; pick++)
        {
            var at = -1;
            for (var i = 0; i < coarse.Length; i++)
            {
                if (coarse[i] > -2 && (at < 0 || coarse[i] > coarse[at]))
                {
                    at = i;
                }
            }

            // A shift of a few milliseconds cannot lift a poor match to a good one.
            if (at < 0 || (pick > 0 && coarse[at] * noiseCorrection < _settings.MatchCorrelation - 0.2))
            {
                break;
            }

            coarse[at] = -2;
            var (c, a, s) = BestShift(beat, _templates[at]);
            if (c > bestCorr)
            {
                (best, bestCorr, bestAmp, bestShift) = (_templates[at], c, a, s);
            }
        }

        // The residual noise and shape differences leave: the beat's energy at the best shift that the template's
        // shape, amplitude fitted, does not explain.
        var residual = best is null ? double.NaN : bestAmp * bestAmp * best.Energy * (1 - bestCorr * bestCorr);
        bestCorr = Math.Min(1, bestCorr * noiseCorrection);
        bestAmp /= noiseCorrection;
        var joins = best is not null && bestCorr >= _settings.MatchCorrelation
            && bestAmp >= 1 / _settings.MatchAmplitudeRatio && bestAmp <= _settings.MatchAmplitudeRatio;
        if (!joins)
        {
            best = Create(beat);
            bestShift = 0;
        }

        Update(best!, beat, bestShift, onTime, widthMs);
        if (_beats % 64 == 0)
        {
            MergeAlike();
        }

        ChooseNormal();
        return new Match(best!, joins ? bestCorr : 1, joins ? bestAmp : 1, bestShift, !joins, residual);
    }

    /// <summary>Correlation and amplitude ratio of a beat against a template at the best shift.</summary>
    public (double Correlation, double Amplitude, int Shift) BestShift(BeatShape beat, MorphologyTemplate t)
    {
        double best = -2, amp = 0;
        var shift = 0;
        for (var s = -beat.Margin; s <= beat.Margin; s++)
        {
            var c = Correlate(beat, t, s, out var a);
            if (c > best)
            {
                (best, amp, shift) = (c, a, s);
            }
        }

        return (best, amp, shift);
    }

    /// <summary>Correlation of two templates at the best shift within ±<paramref name="margin"/> (overlap only), and their amplitude ratio.</summary>
    public (double Correlation, double Amplitude) Compare(MorphologyTemplate a, MorphologyTemplate b, int margin)
    {
        double best = -2;
        for (var s = -margin; s <= margin; s++)
        {
            double dot = 0, ea = 0, eb = 0;
            for (var k = 0; k < _leads; k++)
            {
                var la = a.Mean.AsSpan(k * _segment, _segment);
                var lb = b.Mean.AsSpan(k * _segment, _segment);
                var from = Math.Max(0, s);
                var to = Math.Min(_segment, _segment + s);
                for (var i = from; i < to; i++)
                {
                    double x = la[i], y = lb[i - s];
                    dot += x * y;
                    ea += x * x;
                    eb += y * y;
                }
            }

            if (ea > 0 && eb > 0)
            {
                best = Math.Max(best, dot / Math.Sqrt(ea * eb));
            }
        }

        var amplitude = b.Energy > 0 ? Math.Sqrt(a.Energy / b.Energy) : 0;
        return (best, amplitude);
    }

    private double Correlate(BeatShape beat, MorphologyTemplate t, int shift, out double amplitude)
    {
        double dot = 0, energy = 0;
        for (var k = 0; k < _leads; k++)
        {
            var x = beat.Samples.AsSpan(k * beat.Span + beat.Margin + shift, _segment);
            var y = t.Mean.AsSpan(k * _segment, _segment);
            dot += Dot(x, y);
            energy += beat.Energy(k, shift, out _);
        }

        amplitude = t.Energy > 0 ? Math.Sqrt(energy / t.Energy) : 0;
        return energy > 0 && t.Energy > 0 ? dot / Math.Sqrt(energy * t.Energy) : -1;
    }

    /// <summary>Correlation of the beat's pre-QRS segment with the template's (NaN when the template has none yet).</summary>
    public static double AtrialCorrelation(BeatShape beat, MorphologyTemplate t)
    {
        if (t.AtrialCount == 0)
        {
            return double.NaN;
        }

        double dot = 0, ex = 0, ey = 0;
        var x = beat.Atrial;
        var y = t.Atrial;
        for (var i = 0; i < x.Length; i++)
        {
            dot += x[i] * y[i];
            ex += x[i] * x[i];
            ey += y[i] * y[i];
        }

        return ex > 0 && ey > 0 ? dot / Math.Sqrt(ex * ey) : double.NaN;
    }

    private static double Dot(ReadOnlySpan<float> x, ReadOnlySpan<float> y)
    {
        var acc = Vector<float>.Zero;
        var i = 0;
        var w = Vector<float>.Count;
        for (; i <= x.Length - w; i += w)
        {
            acc += new Vector<float>(x.Slice(i, w)) * new Vector<float>(y.Slice(i, w));
        }

        double sum = Vector.Sum(acc);
        for (; i < x.Length; i++)
        {
            sum += x[i] * y[i];
        }

        return sum;
    }

    private MorphologyTemplate Create(BeatShape beat)
    {
        MorphologyTemplate? slot = null;
        foreach (var t in _templates)
        {
            if (!t.InUse)
            {
                slot = t;
                break;
            }
        }

        if (slot is null)
        {
            // Full: the lightest template other than the normal one gives way.
            foreach (var t in _templates)
            {
                if (t != Normal && (slot is null || t.Weight < slot.Weight))
                {
                    slot = t;
                }
            }
        }

        var s = slot!;
        s.InUse = true;
        s.Id = _nextId;
        _nextId = _nextId == short.MaxValue ? (short)0 : (short)(_nextId + 1);
        s.Count = 0;
        s.Weight = s.OnTimeWeight = s.PrematureWeight = s.VentricularWeight = 0;
        s.SpreadMs = 0;
        s.WidthMs = double.NaN;
        s.WidthLowerQuartileMs = double.NaN;
        s.WidthCount = 0;
        s.QrsMeasuredAt = 0;
        s.QrsOnset = s.QrsOffset = -1;
        s.QrsMs = float.NaN;
        Array.Clear(s.Mean);
        s.Version = ++_versions;
        Array.Clear(s.Atrial);
        s.AtrialCount = 0;
        return s;
    }

    /// <summary>Counts a beat of template <paramref name="id"/> decided V (nothing when the template has gone since).</summary>
    public void MarkVentricular(short id)
    {
        foreach (var t in _templates)
        {
            if (t.InUse && t.Id == id)
            {
                t.VentricularWeight += 1;
                return;
            }
        }
    }

    private void Update(MorphologyTemplate t, BeatShape beat, int shift, bool onTime, double widthMs)
    {
        t.Count++;
        var alpha = Math.Max(1.0 / t.Count, 1.0 / _settings.TemplateAdaptBeats);
        for (var k = 0; k < _leads; k++)
        {
            beat.Energy(k, shift, out var mean);
            var x = beat.Samples.AsSpan(k * beat.Span + beat.Margin + shift, _segment);
            var y = t.Mean.AsSpan(k * _segment, _segment);
            var m = (float)mean;
            var a = (float)alpha;
            for (var i = 0; i < _segment; i++)
            {
                y[i] += a * (x[i] - m - y[i]);
            }
        }

        t.RecomputeEnergy(_leads, _segment);
        t.Version = ++_versions;
        if (onTime)
        {
            t.AtrialCount++;
            var b = (float)Math.Max(1.0 / t.AtrialCount, 1.0 / _settings.TemplateAdaptBeats);
            var x = beat.Atrial;
            for (var i = 0; i < x.Length; i++)
            {
                t.Atrial[i] += b * (x[i] - t.Atrial[i]);
            }
        }

        t.SpreadMs += alpha * (beat.SpreadMs - t.SpreadMs);
        if (!double.IsNaN(widthMs))
        {
            t.WidthMs = double.IsNaN(t.WidthMs) ? widthMs : t.WidthMs + alpha * (widthMs - t.WidthMs);

            // Robbins–Monro quantile step: down by 3 parts below, up by 1 part above, so that it settles where a
            // quarter of the widths lie below (the mean alone cannot tell a few very wide beats from most beats wide).
            var step = _settings.WidthQuartileStepMs;
            t.WidthLowerQuartileMs = double.IsNaN(t.WidthLowerQuartileMs) ? widthMs
                : widthMs < t.WidthLowerQuartileMs ? t.WidthLowerQuartileMs - 0.75 * step
                : widthMs > t.WidthLowerQuartileMs ? t.WidthLowerQuartileMs + 0.25 * step
                : t.WidthLowerQuartileMs;
            t.WidthCount++;
        }

        t.Weight += 1;
        if (onTime)
        {
            t.OnTimeWeight += 1;
        }
        else
        {
            t.PrematureWeight += 1;
        }
    }

    private void MergeAlike()
    {
        for (var i = 0; i < _templates.Length; i++)
        {
            var a = _templates[i];
            if (!a.InUse)
            {
                continue;
            }

            for (var j = i + 1; j < _templates.Length; j++)
            {
                var b = _templates[j];
                if (!b.InUse)
                {
                    continue;
                }

                if (_comparedA[i, j] == a.Version && _comparedB[i, j] == b.Version)
                {
                    continue;
                }

                _comparedA[i, j] = a.Version;
                _comparedB[i, j] = b.Version;
                var (c, amp) = Compare(a, b, 1);
                if (c >= _settings.MergeCorrelation && amp >= 1 / 1.25 && amp <= 1.25)
                {
                    var (keep, drop) = a.Weight >= b.Weight ? (a, b) : (b, a);
                    var wk = keep.Weight / (keep.Weight + drop.Weight);
                    for (var n = 0; n < keep.Mean.Length; n++)
                    {
                        keep.Mean[n] = (float)(wk * keep.Mean[n] + (1 - wk) * drop.Mean[n]);
                    }

                    keep.RecomputeEnergy(_leads, _segment);
                    keep.Version = ++_versions;
                    keep.Count += drop.Count;
                    keep.Weight += drop.Weight;
                    keep.OnTimeWeight += drop.OnTimeWeight;
                    keep.PrematureWeight += drop.PrematureWeight;
                    keep.VentricularWeight += drop.VentricularWeight;
                    drop.InUse = false;
                    if (Normal == drop)
                    {
                        Normal = keep;
                    }

                    if (drop == a)
                    {
                        break;
                    }
                }
            }
        }
    }

    private void ChooseNormal()
    {
        MorphologyTemplate? heaviest = null;
        foreach (var t in _templates)
        {
            if (t.InUse)
            {
                if (heaviest is null || t.OnTimeWeight > heaviest.OnTimeWeight)
                {
                    heaviest = t;
                }
            }
        }

        // Hysteresis: the normal template changes only when another clearly outweighs it.
        if (Normal is null || !Normal.InUse || heaviest!.OnTimeWeight > _settings.NormalSwitchRatio * Normal.OnTimeWeight)
        {
            Normal = heaviest;
        }
    }

    public readonly record struct Match(MorphologyTemplate Template, double Correlation, double Amplitude, int Shift, bool Created, double Residual);
}
