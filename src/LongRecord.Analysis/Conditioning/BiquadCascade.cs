using NWaves.Filters.Base;
using NWaves.Filters.Fda;

namespace LongRecord.Analysis.Conditioning;

/// <summary>
/// A cascade of second-order sections run over blocks with its state carried between calls, so a signal filtered in
/// blocks of any size equals the signal filtered at once. Coefficients come from NWaves' designers (second-order
/// sections: higher orders in transfer-function form lose precision); the loop is our own.
/// </summary>
public sealed class BiquadCascade
{
    private readonly double[] _b0;
    private readonly double[] _b1;
    private readonly double[] _b2;
    private readonly double[] _a1;
    private readonly double[] _a2;
    private readonly double[] _z1;
    private readonly double[] _z2;

    public BiquadCascade(TransferFunction design)
        : this(DesignFilter.TfToSos(design))
    {
    }

    public BiquadCascade(IReadOnlyList<TransferFunction> sections)
    {
        var n = sections.Count;
        _b0 = new double[n];
        _b1 = new double[n];
        _b2 = new double[n];
        _a1 = new double[n];
        _a2 = new double[n];
        _z1 = new double[n];
        _z2 = new double[n];
        for (var i = 0; i < n; i++)
        {
            var b = Pad3(sections[i].Numerator);
            var a = Pad3(sections[i].Denominator);
            _b0[i] = b[0] / a[0];
            _b1[i] = b[1] / a[0];
            _b2[i] = b[2] / a[0];
            _a1[i] = a[1] / a[0];
            _a2[i] = a[2] / a[0];
        }
    }

    public int Sections => _b0.Length;

    /// <summary>Filters <paramref name="signal"/> in place (transposed direct form II per section).</summary>
    public void Process(Span<float> signal)
    {
        for (var s = 0; s < _b0.Length; s++)
        {
            double b0 = _b0[s], b1 = _b1[s], b2 = _b2[s], a1 = _a1[s], a2 = _a2[s];
            double z1 = _z1[s], z2 = _z2[s];
            for (var i = 0; i < signal.Length; i++)
            {
                double x = signal[i];
                var y = b0 * x + z1;
                z1 = b1 * x - a1 * y + z2;
                z2 = b2 * x - a2 * y;
                signal[i] = (float)y;
            }

            _z1[s] = z1;
            _z2[s] = z2;
        }
    }

    /// <summary>Sets the state as if the input had been <paramref name="x"/> forever (no start-up transient).</summary>
    public void SettleAt(float x)
    {
        double v = x;
        for (var s = 0; s < _b0.Length; s++)
        {
            // Steady state of TDF-II for constant input v: y = H(1) v; z2 = b2 v − a2 y; z1 = y − b0 v.
            var dc = (_b0[s] + _b1[s] + _b2[s]) / (1 + _a1[s] + _a2[s]);
            var y = dc * v;
            _z2[s] = _b2[s] * v - _a2[s] * y;
            _z1[s] = y - _b0[s] * v;
            v = y;
        }
    }

    public void Reset()
    {
        Array.Clear(_z1);
        Array.Clear(_z2);
    }

    private static double[] Pad3(double[] c) => [c[0], c.Length > 1 ? c[1] : 0, c.Length > 2 ? c[2] : 0];
}
