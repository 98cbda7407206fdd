using NWaves.Filters.Fda;

namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>
/// A Butterworth low-pass (designed by NWaves, run as second-order sections by our own loop) applied forward and then
/// backward over a short stretch: zero phase, so wave boundaries do not move; the magnitude response is squared
/// (−6 dB at the corner). Each call starts from the stretch's own edge values (steady state), so nothing passes
/// between windows.
/// </summary>
internal sealed class ZeroPhaseLowPass
{
    private readonly double[] _b0;
    private readonly double[] _b1;
    private readonly double[] _b2;
    private readonly double[] _a1;
    private readonly double[] _a2;
    private readonly double[] _gain;

    public ZeroPhaseLowPass(double cornerHz, double samplingRateHz, int order = 2)
    {
        // NWaves takes the corner divided by the sampling rate; keep it below Nyquist for slow recordings.
        var normalised = Math.Min(cornerHz, 0.45 * samplingRateHz) / samplingRateHz;
        var sections = DesignFilter.TfToSos(new NWaves.Filters.Butterworth.LowPassFilter(normalised, order).Tf);
        var n = sections.Length;
        _b0 = new double[n];
        _b1 = new double[n];
        _b2 = new double[n];
        _a1 = new double[n];
        _a2 = new double[n];
        _gain = new double[n];
        for (var i = 0; i < n; i++)
        {
            var b = sections[i].Numerator;
            var a = sections[i].Denominator;
            _b0[i] = b[0] / a[0];
            _b1[i] = (b.Length > 1 ? b[1] : 0) / a[0];
            _b2[i] = (b.Length > 2 ? b[2] : 0) / a[0];
            _a1[i] = (a.Length > 1 ? a[1] : 0) / a[0];
            _a2[i] = (a.Length > 2 ? a[2] : 0) / a[0];
            _gain[i] = (_b0[i] + _b1[i] + _b2[i]) / (1 + _a1[i] + _a2[i]);
        }
    }

    /// <summary>Writes the filtered <paramref name="source"/> into <paramref name="destination"/> (same length).</summary>
    public void Apply(ReadOnlySpan<float> source, Span<float> destination)
    {
        source.CopyTo(destination);
        if (destination.IsEmpty)
        {
            return;
        }

        for (var s = 0; s < _b0.Length; s++)
        {
            Forward(destination, s);
            Backward(destination, s);
        }
    }

    /// <summary>
    /// Filters two stretches of equal length at once, <paramref name="a"/> with this filter and <paramref name="b"/> with
    /// <paramref name="other"/> (each in place). The two recursions are independent, so running them in one loop lets
    /// the processor overlap them; the result equals two <see cref="Apply"/> calls.
    /// </summary>
    public void ApplyPair(Span<float> a, ZeroPhaseLowPass other, Span<float> b)
    {
        if (a.Length != b.Length || _b0.Length != 1 || other._b0.Length != 1 || a.IsEmpty)
        {
            Apply(a, a);
            other.Apply(b, b);
            return;
        }

        var fa = new Section(this);
        var fb = new Section(other);
        fa.Start(a[0]);
        fb.Start(b[0]);
        for (var i = 0; i < a.Length; i++)
        {
            a[i] = fa.Step(a[i]);
            b[i] = fb.Step(b[i]);
        }

        fa.Start(a[^1]);
        fb.Start(b[^1]);
        for (var i = a.Length - 1; i >= 0; i--)
        {
            a[i] = fa.Step(a[i]);
            b[i] = fb.Step(b[i]);
        }
    }

    /// <summary>
    /// Four stretches of equal length at once: <paramref name="a"/> and <paramref name="c"/> with this filter,
    /// <paramref name="b"/> and <paramref name="d"/> with <paramref name="other"/> (each in place).
    /// </summary>
    public void ApplyFour(Span<float> a, ZeroPhaseLowPass other, Span<float> b, Span<float> c, Span<float> d)
    {
        if (a.Length != b.Length || a.Length != c.Length || a.Length != d.Length || _b0.Length != 1 || other._b0.Length != 1 || a.IsEmpty)
        {
            ApplyPair(a, other, b);
            ApplyPair(c, other, d);
            return;
        }

        var fa = new Section(this);
        var fb = new Section(other);
        var fc = new Section(this);
        var fd = new Section(other);
        fa.Start(a[0]);
        fb.Start(b[0]);
        fc.Start(c[0]);
        fd.Start(d[0]);
        for (var i = 0; i < a.Length; i++)
        {
            a[i] = fa.Step(a[i]);
            b[i] = fb.Step(b[i]);
            c[i] = fc.Step(c[i]);
            d[i] = fd.Step(d[i]);
        }

        fa.Start(a[^1]);
        fb.Start(b[^1]);
        fc.Start(c[^1]);
        fd.Start(d[^1]);
        for (var i = a.Length - 1; i >= 0; i--)
        {
            a[i] = fa.Step(a[i]);
            b[i] = fb.Step(b[i]);
            c[i] = fc.Step(c[i]);
            d[i] = fd.Step(d[i]);
        }
    }

    // One second-order section's coefficients and state, kept in locals by the JIT.
    private struct Section(ZeroPhaseLowPass f)
    {
        private readonly double _b0 = f._b0[0], _b1 = f._b1[0], _b2 = f._b2[0], _a1 = f._a1[0], _a2 = f._a2[0], _gain = f._gain[0];
        private double _z1;
        private double _z2;

        public void Start(double v)
        {
            var y0 = _gain * v;
            _z2 = _b2 * v - _a2 * y0;
            _z1 = y0 - _b0 * v;
        }

        public float Step(double u)
        {
            var y = _b0 * u + _z1;
            _z1 = _b1 * u - _a1 * y + _z2;
            _z2 = _b2 * u - _a2 * y;
            return (float)y;
        }
    }

    // Transposed direct form II, started in the steady state of the first input value.
    private void Forward(Span<float> x, int s)
    {
        double b0 = _b0[s], b1 = _b1[s], b2 = _b2[s], a1 = _a1[s], a2 = _a2[s];
        double v = x[0];
        var y0 = _gain[s] * v;
        var z2 = b2 * v - a2 * y0;
        var z1 = y0 - b0 * v;
        for (var i = 0; i < x.Length; i++)
        {
            double u = x[i];
            var y = b0 * u + z1;
            z1 = b1 * u - a1 * y + z2;
            z2 = b2 * u - a2 * y;
            x[i] = (float)y;
        }
    }

    private void Backward(Span<float> x, int s)
    {
        double b0 = _b0[s], b1 = _b1[s], b2 = _b2[s], a1 = _a1[s], a2 = _a2[s];
        double v = x[^1];
        var y0 = _gain[s] * v;
        var z2 = b2 * v - a2 * y0;
        var z1 = y0 - b0 * v;
        for (var i = x.Length - 1; i >= 0; i--)
        {
            double u = x[i];
            var y = b0 * u + z1;
            z1 = b1 * u - a1 * y + z2;
            z2 = b2 * u - a2 * y;
            x[i] = (float)y;
        }
    }
}
