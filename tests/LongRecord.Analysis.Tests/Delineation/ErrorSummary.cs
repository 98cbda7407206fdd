using System.Globalization;

namespace LongRecord.Analysis.Tests.Delineation;

/// <summary>Mean, standard deviation and count of signed errors, printed in the invariant culture.</summary>
internal sealed class ErrorSummary
{
    private readonly List<double> _values = new();

    public int Count => _values.Count;

    public double Mean => _values.Count == 0 ? double.NaN : _values.Average();

    public double Sd
    {
        get
        {
            if (_values.Count < 2)
            {
                return double.NaN;
            }

            var m = Mean;
            return Math.Sqrt(_values.Sum(v => (v - m) * (v - m)) / (_values.Count - 1));
        }
    }

    public double MedianAbsolute
    {
        get
        {
            if (_values.Count == 0)
            {
                return double.NaN;
            }

            var a = _values.Select(Math.Abs).OrderBy(v => v).ToArray();
            return a[a.Length / 2];
        }
    }

    public void Add(double value) => _values.Add(value);

    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Mean,6:F1} ± {Sd,5:F1} ms (n = {Count})");
}
