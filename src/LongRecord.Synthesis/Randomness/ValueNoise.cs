namespace LongRecord.Synthesis.Randomness;

/// <summary>
/// Smooth random function of time: normal values at integer knots, Catmull–Rom interpolation between them.
/// Random access (no state), so any block of samples gets the same values. Roughly unit variance at knots,
/// about 0.8 of that between them; callers that need an exact level calibrate numerically.
/// </summary>
internal static class ValueNoise
{
    public static double At(ulong seed, ulong stream, double x)
    {
        var k = Math.Floor(x);
        var f = x - k;
        var i = (long)k;
        var p0 = CounterRandom.Gaussian(seed, stream, i - 1);
        var p1 = CounterRandom.Gaussian(seed, stream, i);
        var p2 = CounterRandom.Gaussian(seed, stream, i + 1);
        var p3 = CounterRandom.Gaussian(seed, stream, i + 2);
        var f2 = f * f;
        var f3 = f2 * f;
        return 0.5 * ((2.0 * p1) + (-p0 + p2) * f + (2.0 * p0 - 5.0 * p1 + 4.0 * p2 - p3) * f2 + (-p0 + 3.0 * p1 - 3.0 * p2 + p3) * f3);
    }
}
