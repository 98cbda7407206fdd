using System.Globalization;

namespace LongRecord.Formats.Csv;

/// <summary>
/// Infers the sampling rate from the time column in one pass and checks every step against it.
/// The interval is the least-squares slope of time against row number (Welford-style running co-moments, stable over
/// 10⁹ rows). The rate is then snapped to the coarsest grid of 1, 0.1, 0.01 or 0.001 Hz that lies within the
/// uncertainty left by the decimals written, so 1/360 s written to 6 places still gives exactly 360 Hz.
/// </summary>
internal sealed class CsvRateEstimator
{
    /// <summary>
    /// A step may differ from the sampling interval by 10 % of it (common practice, no source) plus the rounding of the
    /// two times as written: half a unit of each one's last decimal.
    /// </summary>
    public const double JitterFraction = 0.10;

    private static readonly double[] s_grids = [1, 0.1, 0.01, 0.001];

    private long _count;
    private double _meanRow;
    private double _meanTime;
    private double _coMoment;
    private double _rowMoment;
    private double _previousTime;
    private double _previousHalfUnit;
    private double _coarsestUnit;
    private Step _longest = new(double.NegativeInfinity, 0, 0, 0);
    private Step _shortest = new(double.PositiveInfinity, 0, 0, 0);

    public long Count => _count;

    /// <summary>Adds a row's time (seconds from any origin, strictly increasing) written with <paramref name="decimals"/> places.</summary>
    public void Add(double timeS, int decimals, long line, long byteOffset)
    {
        var unit = Math.Pow(10, -decimals);
        var half = unit / 2;
        if (_count > 0)
        {
            var step = timeS - _previousTime;
            var rounding = half + _previousHalfUnit;
            if (step - rounding > _longest.Bound)
            {
                _longest = new Step(step - rounding, step, line, byteOffset);
            }

            if (step + rounding < _shortest.Bound)
            {
                _shortest = new Step(step + rounding, step, line, byteOffset);
            }
        }

        _count++;
        var dx = _count - 1 - _meanRow;
        _meanRow += dx / _count;
        _meanTime += (timeS - _meanTime) / _count;
        _coMoment += dx * (timeS - _meanTime);
        _rowMoment += dx * (_count - 1 - _meanRow);
        _previousTime = timeS;
        _previousHalfUnit = half;
        _coarsestUnit = Math.Max(_coarsestUnit, unit);
    }

    /// <summary>The sampling rate, after checking every step; needs at least two rows.</summary>
    public double Finish(string path)
    {
        var interval = _coMoment / _rowMoment;
        var rate = Snap(1 / interval, interval);
        var expected = 1 / rate;
        var tolerance = JitterFraction * expected;
        var tooLong = _longest.Bound - (expected + tolerance);
        var tooShort = (expected - tolerance) - _shortest.Bound;
        if (tooLong > 0 || tooShort > 0)
        {
            var worst = tooLong >= tooShort ? _longest : _shortest;
            RecordingFormatException.Throw(path,
                string.Create(CultureInfo.InvariantCulture,
                    $"time step of {worst.StepS:G6} s at line {worst.Line} deviates from the sampling interval {expected:G6} s ({rate:G8} Hz) by more than {JitterFraction * 100:G3} %"),
                worst.ByteOffset, "time");
        }

        return rate;
    }

    private double Snap(double rate, double interval)
    {
        // Least squares against bounded rounding errors (±u/2 each) moves the slope by at most 1.5 u / (n − 1);
        // twice u / (n − 1) leaves a margin.
        var slack = 2 * _coarsestUnit / (_count - 1);
        var lowest = 1 / (interval + slack);
        var highest = interval > slack ? 1 / (interval - slack) : double.PositiveInfinity;
        foreach (var grid in s_grids)
        {
            var candidate = Math.Round(rate / grid) * grid;
            if (candidate > 0 && candidate >= lowest && candidate <= highest)
            {
                return Math.Round(candidate, 3);
            }
        }

        return rate;
    }

    private readonly record struct Step(double Bound, double StepS, long Line, long ByteOffset);
}
