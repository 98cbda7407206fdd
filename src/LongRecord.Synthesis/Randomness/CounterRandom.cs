namespace LongRecord.Synthesis.Randomness;

/// <summary>
/// Counter-based random numbers: every value is a pure function of (seed, stream, index), so a sample's noise does
/// not depend on which block it is rendered in. The mixing function is the SplitMix64 finaliser (Steele, Lea and
/// Flood, "Fast splittable pseudorandom number generators", OOPSLA 2014; constants from memory).
/// </summary>
internal static class CounterRandom
{
    public static ulong Mix(ulong z)
    {
        z += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    public static ulong Hash(ulong seed, ulong stream, long index) =>
        Mix(Mix(seed ^ Mix(stream)) ^ (ulong)index);

    /// <summary>Uniform in [0, 1) with 53 random bits.</summary>
    public static double Uniform(ulong seed, ulong stream, long index) =>
        (Hash(seed, stream, index) >> 11) * (1.0 / 9007199254740992.0);

    /// <summary>Standard normal value (Box–Muller on two independent uniforms of the same index).</summary>
    public static double Gaussian(ulong seed, ulong stream, long index)
    {
        var h = Hash(seed, stream, index);
        var u1 = ((h >> 11) + 1) * (1.0 / 9007199254740993.0);
        var u2 = (Mix(h) >> 11) * (1.0 / 9007199254740992.0);
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }

    /// <summary>
    /// Cheap near-normal value (sum of four 16-bit uniforms, scaled to unit variance; bounded at ±3.46) for per-sample
    /// noise, where the exact tails do not matter and Box–Muller would dominate the render time.
    /// </summary>
    public static double NearGaussian(ulong seed, ulong stream, long index)
    {
        var h = Hash(seed, stream, index);
        var sum = (double)(h & 0xFFFF) + ((h >> 16) & 0xFFFF) + ((h >> 32) & 0xFFFF) + (h >> 48);
        return (sum / 65536.0 - 2.0) * 1.7320508075688772;
    }
}
