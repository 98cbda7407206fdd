using LongRecord.Analysis.Rhythm;
using MathNet.Numerics.Distributions;
using MathNet.Numerics.Random;
using MathNet.Numerics.Statistics;
using Xunit.Abstractions;

namespace LongRecord.Analysis.Tests.Rhythm;

/// <summary>Sample entropy (Richman and Moorman 2000) against values derived from its definition.</summary>
public sealed class SampleEntropyTests(ITestOutputHelper output)
{
    [Fact]
    public void GaussianWhiteNoise_m2_r02_IsMinusLnOfMatchProbability()
    {
        // For independent X, Y ~ N(0, σ²), X − Y ~ N(0, 2σ²): P(|X − Y| ≤ 0.2σ) = 2Φ(0.2/√2) − 1 = 0.1125, and for white
        // noise A/B is that probability, so SampEn = −ln 0.1125 = 2.185 (N = 10 000: ± 0.06, per the issue).
        var p = 2 * Normal.CDF(0, 1, 0.2 / Math.Sqrt(2)) - 1;
        var expected = -Math.Log(p);
        var x = new double[10000];
        Normal.Samples(new MersenneTwister(20260311), x, 0, 1);
        var r = 0.2 * x.StandardDeviation();
        var sampEn = SampleEntropy.Compute(x, 2, r);
        output.WriteLine($"P {p:F4}, expected {expected:F3}, measured {sampEn:F3}");
        Assert.Equal(0.1125, p, 4);
        Assert.InRange(sampEn, expected - 0.06, expected + 0.06);
    }

    [Theory]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(5)]
    public void ExactlyPeriodicSequence_HasNearZeroEntropy(int period)
    {
        // Templates of the same phase match at every length when the sequence repeats exactly, so A ≈ B and SampEn ≈ 0,
        // as long as templates of different phases do not fall within r of each other (with r = 0.2 SD that holds for
        // a few random cycle values; a random 20-value cycle has cross-phase matches and gives about 0.3).
        var rng = new MersenneTwister(period);
        var cycle = Enumerable.Range(0, period).Select(_ => 0.6 + 0.4 * rng.NextDouble()).ToArray();
        var x = Enumerable.Range(0, 1000).Select(i => cycle[i % period]).ToArray();
        var sampEn = SampleEntropy.Compute(x, 2, 0.2 * x.StandardDeviation());
        output.WriteLine($"period {period}: SampEn {sampEn:F5}");
        Assert.InRange(sampEn, 0, 0.01);
    }

    [Fact]
    public void TooShortOrConstant_IsUndefined()
    {
        Assert.True(double.IsNaN(SampleEntropy.Compute([1.0, 2.0, 3.0], 2, 0.1)));
    }

    [Fact]
    public void Cosen_IsSampEnPlusLnTwoROverMean_UnitFree()
    {
        // Lake & Moorman 2011: COSEn = SampEn + ln(2r) − ln(mean RR); r and mean in the same unit give the same value.
        Assert.Equal(1.5 + Math.Log(2 * 0.02) - Math.Log(0.8), SampleEntropy.Coefficient(1.5, 0.02, 0.8), 12);
        Assert.Equal(SampleEntropy.Coefficient(1.5, 0.02, 0.8), SampleEntropy.Coefficient(1.5, 20, 800), 12);
    }
}
