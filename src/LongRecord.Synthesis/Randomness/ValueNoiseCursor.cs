namespace LongRecord.Synthesis.Randomness;

/// <summary>
/// <see cref="ValueNoise"/> evaluated along increasing positions, caching the four knots in use. Gives exactly the
/// values of <see cref="ValueNoise.At"/> (same knots, same arithmetic), only faster.
/// </summary>
internal struct ValueNoiseCursor(ulong seed, ulong stream)
{
    private long _knot = long.MinValue;
    private double _p0, _p1, _p2, _p3;

    public double At(double x)
    {
        var k = Math.Floor(x);
        var i = (long)k;
        if (i != _knot)
        {
            if (i == _knot + 1)
            {
                (_p0, _p1, _p2) = (_p1, _p2, _p3);
                _p3 = CounterRandom.Gaussian(seed, stream, i + 2);
            }
            else
            {
                _p0 = CounterRandom.Gaussian(seed, stream, i - 1);
                _p1 = CounterRandom.Gaussian(seed, stream, i);
                _p2 = CounterRandom.Gaussian(seed, stream, i + 1);
                _p3 = CounterRandom.Gaussian(seed, stream, i + 2);
            }

            _knot = i;
        }

        var f = x - k;
        var f2 = f * f;
        var f3 = f2 * f;
        return 0.5 * ((2.0 * _p1) + (-_p0 + _p2) * f + (2.0 * _p0 - 5.0 * _p1 + 4.0 * _p2 - _p3) * f2 + (-_p0 + 3.0 * _p1 - 3.0 * _p2 + _p3) * f3);
    }
}
