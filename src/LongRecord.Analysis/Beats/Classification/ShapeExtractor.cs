using LongRecord.Analysis.Numerics;

namespace LongRecord.Analysis.Beats.Classification;

/// <summary>
/// Cuts the QRS-centred segment out of a beat's signal window and measures the beat's own morphology features.
/// The centre is the centroid of the QRS slope energy (summed over leads), found twice in a row so that a fiducial
/// a few tens of milliseconds off still lands on the same point for beats of one shape.
/// </summary>
internal sealed class ShapeExtractor
{
    private readonly double _fs;
    private readonly int _leads;
    private readonly int _before;
    private readonly int _centroidHalf;
    private readonly int _spreadHalf;
    private readonly int _quietHalf;
    private readonly int _noiseReach;
    private readonly double[] _energy;
    private readonly int _atrialFrom;

    public ShapeExtractor(double samplingRateHz, int leads, ClassificationSettings settings)
    {
        _fs = samplingRateHz;
        _leads = leads;
        _before = Samples(settings.SegmentBeforeMs);
        Segment = _before + Samples(settings.SegmentAfterMs);
        Margin = Math.Max(1, Samples(settings.ShiftMs));
        _centroidHalf = Math.Max(2, Samples(60));
        _spreadHalf = Math.Max(3, Samples(150));
        _quietHalf = Math.Max(2, Samples(100));
        _noiseReach = Math.Max(_quietHalf + 2, Samples(400));
        _atrialFrom = Samples(settings.AtrialFromMs);
        AtrialLength = Math.Max(2, _atrialFrom - Samples(settings.AtrialToMs));
        _energy = new double[2 * _spreadHalf + 1];
    }

    public int Segment { get; }

    /// <summary>Samples of the segment before its centre (the aligned QRS centre sits at this index).</summary>
    public int Before => _before;

    public int Margin { get; }

    public int AtrialLength { get; }

    public BeatShape NewShape() => new(_leads, Segment, Margin, AtrialLength);

    /// <summary>Fills <paramref name="shape"/> from a lead-major window; false (and shape invalid) when the window is unusable.</summary>
    public bool Extract(ReadOnlySpan<float> window, int length, int fiducialIndex, BeatShape shape)
    {
        shape.Valid = false;
        if (length <= 0 || window.Length < _leads * length)
        {
            return false;
        }

        var centre = fiducialIndex;
        for (var pass = 0; pass < 2; pass++)
        {
            centre = Centroid(window, length, centre, _centroidHalf);
            if (centre < 0)
            {
                return false;
            }
        }

        var start = centre - _before - Margin;
        var atrialStart = centre - _atrialFrom;
        if (start < 0 || atrialStart < 0 || start + shape.Span > length || centre - _spreadHalf - 1 < 0 || centre + _spreadHalf + 1 >= length)
        {
            return false;
        }

        for (var k = 0; k < _leads; k++)
        {
            var src = window.Slice(k * length + start, shape.Span);
            if (SpanStatistics.HasNaN(src))
            {
                return false; // a gap (NaN)
            }

            src.CopyTo(shape.Samples.AsSpan(k * shape.Span, shape.Span));
        }

        for (var k = 0; k < _leads; k++)
        {
            var src = window.Slice(k * length + atrialStart, AtrialLength);
            if (SpanStatistics.HasNaN(src))
            {
                return false;
            }

            var dst = shape.Atrial.AsSpan(k * AtrialLength, AtrialLength);
            double sum = 0;
            for (var i = 0; i < src.Length; i++)
            {
                sum += src[i];
            }

            var mean = (float)(sum / src.Length);
            for (var i = 0; i < src.Length; i++)
            {
                dst[i] = src[i] - mean;
            }
        }

        shape.CentreIndex = centre;
        shape.BuildSums();
        MeasureSpread(window, length, centre, shape);
        shape.NoiseLevel = NoiseLevel(window, length, centre);
        shape.NoiseRatio = shape.PeakSlope > 0 ? shape.NoiseLevel / shape.PeakSlope : 0;
        shape.Valid = true;
        return true;
    }

    private int Samples(double ms) => (int)Math.Round(ms * 0.001 * _fs);

    private int Centroid(ReadOnlySpan<float> window, int length, int around, int half)
    {
        var from = Math.Max(1, around - half);
        var to = Math.Min(length - 2, around + half);
        if (from > to)
        {
            return -1;
        }

        double sum = 0, moment = 0;
        for (var t = from; t <= to; t++)
        {
            double e = 0;
            for (var k = 0; k < _leads; k++)
            {
                var d = window[k * length + t + 1] - window[k * length + t - 1];
                e += d * d;
            }

            if (double.IsNaN(e))
            {
                return -1;
            }

            sum += e;
            moment += e * t;
        }

        return sum > 0 ? (int)Math.Round(moment / sum) : around;
    }

    private void MeasureSpread(ReadOnlySpan<float> window, int length, int centre, BeatShape shape)
    {
        double total = 0, peak = 0;
        for (var j = -_spreadHalf; j <= _spreadHalf; j++)
        {
            var t = centre + j;
            double e = 0, slope = 0;
            for (var k = 0; k < _leads; k++)
            {
                var d = 0.5 * (window[k * length + t + 1] - window[k * length + t - 1]);
                e += d * d;
                slope += Math.Abs(d);
            }

            _energy[j + _spreadHalf] = e;
            total += e;
            peak = Math.Max(peak, slope);
        }

        shape.PeakSlope = (float)peak;
        if (total <= 0)
        {
            shape.SpreadMs = 0;
            return;
        }

        double run = 0;
        int lo = 0, hi = _energy.Length - 1;
        var loFound = false;
        for (var i = 0; i < _energy.Length; i++)
        {
            run += _energy[i];
            if (!loFound && run >= 0.1 * total)
            {
                lo = i;
                loFound = true;
            }

            if (run >= 0.9 * total)
            {
                hi = i;
                break;
            }
        }

        shape.SpreadMs = (float)((hi - lo + 1) * 1000.0 / _fs);
    }

    // Mean absolute second difference away from the QRS (100 to 400 ms either side, every other sample); against the
    // QRS's largest slope it is the noise ratio: muscle noise and electrode artefact raise it, clean baseline and slow
    // P/T waves barely do.
    private float NoiseLevel(ReadOnlySpan<float> window, int length, int centre)
    {
        double sum = 0;
        var n = 0;
        for (var k = 0; k < _leads; k++)
        {
            var lead = window.Slice(k * length, length);
            n += SumSecondDifference(lead, Math.Max(1, centre - _noiseReach), centre - _quietHalf, ref sum);
            n += SumSecondDifference(lead, centre + _quietHalf, Math.Min(length - 1, centre + _noiseReach), ref sum);
        }

        return n == 0 ? 0 : (float)(sum / n);
    }

    private static int SumSecondDifference(ReadOnlySpan<float> lead, int from, int to, ref double sum)
    {
        var n = 0;
        for (var t = from; t < to; t += 2)
        {
            var d2 = lead[t + 1] - 2 * lead[t] + lead[t - 1];
            if (!float.IsNaN(d2))
            {
                sum += Math.Abs(d2);
                n++;
            }
        }

        return n;
    }
}
