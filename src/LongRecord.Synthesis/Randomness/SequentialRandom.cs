namespace LongRecord.Synthesis.Randomness;

/// <summary>
/// A SplitMix64 sequence for the beat schedule, which is built once and in order, so carried state is safe there.
/// Rendering never uses it (see <see cref="CounterRandom"/>).
/// </summary>
internal sealed class SequentialRandom(ulong seed)
{
    private ulong _state = CounterRandom.Mix(seed ^ 0x5DEECE66DUL);

    public ulong NextUInt64()
    {
        _state += 0x9E3779B97F4A7C15UL;
        var z = _state;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    public double NextDouble() => (NextUInt64() >> 11) * (1.0 / 9007199254740992.0);

    public double Uniform(double low, double high) => low + (high - low) * NextDouble();

    public double NextGaussian()
    {
        var u1 = 1.0 - NextDouble();
        var u2 = NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }

    /// <summary>A fresh seed for a sub-generator (for example one noise stretch).</summary>
    public ulong NextSeed() => NextUInt64();
}
