namespace LongRecord.Analysis.Beats.Classification;

/// <summary>
/// The QRS-centred segment of one beat on every lead, with a margin on both sides so that it can be compared
/// with a template at small shifts, and the beat's own morphology features.
/// </summary>
internal sealed class BeatShape
{
    public BeatShape(int leads, int segment, int margin, int atrial)
    {
        AtrialLength = atrial;
        Atrial = new float[leads * atrial];
        Leads = leads;
        Segment = segment;
        Margin = margin;
        Span = segment + 2 * margin;
        Samples = new float[leads * Span];
        Prefix = new double[leads * (Span + 1)];
        PrefixSquares = new double[leads * (Span + 1)];
    }

    public int Leads { get; }

    /// <summary>Samples per lead of the segment before the QRS where a P wave lies.</summary>
    public int AtrialLength { get; }

    /// <summary>The pre-QRS segment, zero-mean per lead, lead-major.</summary>
    public float[] Atrial { get; }

    /// <summary>Samples per lead that a template holds.</summary>
    public int Segment { get; }

    /// <summary>Extra samples on each side (the largest shift tried).</summary>
    public int Margin { get; }

    /// <summary>Samples per lead held here: <see cref="Segment"/> + 2 × <see cref="Margin"/>.</summary>
    public int Span { get; }

    /// <summary>Lead-major samples, lead k at k × <see cref="Span"/>.</summary>
    public float[] Samples { get; }

    // Running sums per lead (Span + 1 entries each) so that mean and energy at any shift cost O(1).
    public double[] Prefix { get; }

    public double[] PrefixSquares { get; }

    /// <summary>Window index of the segment centre (the aligned QRS centre).</summary>
    public int CentreIndex { get; set; }

    /// <summary>Spread of the QRS slope energy (10 % to 90 % of its cumulative sum), ms: a proxy for QRS width.</summary>
    public float SpreadMs { get; set; }

    /// <summary>Largest absolute slope in the QRS, summed over leads (mV per sample).</summary>
    public float PeakSlope { get; set; }

    /// <summary>Slope energy outside the QRS relative to the QRS's own (higher for noisy beats).</summary>
    public float NoiseRatio { get; set; }

    /// <summary>Mean absolute second difference outside the QRS over all leads (mV): the beat's own noise level.</summary>
    public float NoiseLevel { get; set; }

    /// <summary>Zero-mean energy of the segment at zero shift, summed over leads.</summary>
    public double TotalEnergy()
    {
        double e = 0;
        for (var k = 0; k < Leads; k++)
        {
            e += Energy(k, 0, out _);
        }

        return e;
    }

    public bool Valid { get; set; }

    /// <summary>Zero-mean energy of lead <paramref name="k"/> over the segment at shift <paramref name="shift"/>.</summary>
    public double Energy(int k, int shift, out double mean)
    {
        var b = k * (Span + 1);
        var from = Margin + shift;
        var to = from + Segment;
        var s = Prefix[b + to] - Prefix[b + from];
        var s2 = PrefixSquares[b + to] - PrefixSquares[b + from];
        mean = s / Segment;
        return Math.Max(0, s2 - s * mean);
    }

    public void BuildSums()
    {
        // Two leads per loop: four chains of additions side by side instead of two, each in its own order.
        var k = 0;
        for (; k + 1 < Leads; k += 2)
        {
            BuildSums(k, k + 1);
        }

        if (k < Leads)
        {
            BuildSums(k, k);
        }
    }

    // Running sums of leads k0 and k1 (the same lead twice for an odd one out: both write the same values).
    private void BuildSums(int k0, int k1)
    {
        var n = Span;
        var x0 = Samples.AsSpan(k0 * n, n);
        var x1 = Samples.AsSpan(k1 * n, n);
        var p0 = Prefix.AsSpan(k0 * (n + 1), n + 1);
        var p1 = Prefix.AsSpan(k1 * (n + 1), n + 1);
        var q0 = PrefixSquares.AsSpan(k0 * (n + 1), n + 1);
        var q1 = PrefixSquares.AsSpan(k1 * (n + 1), n + 1);
        double s0 = 0, s1 = 0, t0 = 0, t1 = 0;
        p0[0] = p1[0] = q0[0] = q1[0] = 0;
        for (var i = 0; i < n; i++)
        {
            double a = x0[i], b = x1[i];
            s0 += a;
            t0 += a * a;
            s1 += b;
            t1 += b * b;
            p0[i + 1] = s0;
            q0[i + 1] = t0;
            p1[i + 1] = s1;
            q1[i + 1] = t1;
        }
    }
}
