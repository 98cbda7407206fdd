using LongRecord.Analysis.Beats.Classification;

namespace LongRecord.Analysis.Tests.Classification;

/// <summary>
/// The noise allowance of shape comparison (<see cref="NoiseFloor"/>) against the statistics of a signal in independent
/// noise: a waveform s of energy E plus zero-mean noise of energy N correlates with s at √(E ÷ (E + N)) on average —
/// the attenuation of a correlation by an unreliable measurement (Spearman 1904; textbook statistics, from memory).
/// </summary>
public sealed class NoiseFloorTests
{
    [Theory]
    [InlineData(0.05)]
    [InlineData(0.2)]
    [InlineData(0.5)]
    public void SameShapeCorrelation_IsTheMeanCorrelationOfAShapeWithItselfInWhiteNoise(double noiseToSignal)
    {
        var random = new Random(11);
        const int length = 120;
        var shape = new double[length];
        for (var i = 0; i < length; i++)
        {
            shape[i] = Math.Exp(-0.5 * Math.Pow((i - 60) / 6.0, 2)) - 0.4 * Math.Exp(-0.5 * Math.Pow((i - 72) / 4.0, 2));
        }

        var mean = shape.Average();
        var signalEnergy = shape.Sum(v => (v - mean) * (v - mean));
        var sigma = Math.Sqrt(noiseToSignal * signalEnergy / length);
        double sum = 0;
        const int trials = 400;
        for (var trial = 0; trial < trials; trial++)
        {
            var noisy = shape.Select(v => v + sigma * Gaussian(random)).ToArray();
            sum += Correlation(shape, noisy);
        }

        // The beat's energy is signal plus noise; the noise's share of it is what the floor knows.
        var noiseEnergy = noiseToSignal * signalEnergy;
        var predicted = NoiseFloor.SameShapeCorrelation(noiseEnergy, signalEnergy + noiseEnergy);
        Assert.Equal(Math.Sqrt(1 / (1 + noiseToSignal)), predicted, 9);
        Assert.InRange(sum / trials, predicted - 0.01, predicted + 0.01);
    }

    [Fact]
    public void Correction_LeavesCleanBeatsAlone_AndBringsANoisyBeatOfTheSameShapeToTheCleanLevel()
    {
        var settings = ClassificationSettings.Default;
        var floor = new NoiseFloor(settings);

        // Noise 3 % of the beat's energy: a same-shape beat still correlates √0.97 = 0.985, above the clean level
        // (0.98), nothing to correct.
        Assert.Equal(1, floor.Correction(0.03, 1));

        // A fifth: the same-shape correlation √0.8 = 0.894 is scaled up to the clean level.
        var expected = Math.Sqrt(0.8);
        Assert.Equal(settings.CleanShapeCorrelation, expected * floor.Correction(0.2, 1), 9);
    }

    [Fact]
    public void ResidualFor_IsLearnedFromTheNeighbours_AndAFewEctopicBeatsDoNotMoveIt()
    {
        var floor = new NoiseFloor(ClassificationSettings.Default);
        Assert.Equal(0, floor.ResidualFor(0.01));

        // Twelve beats whose residual is 300 × their squared noise level, four ectopic ones far above it (no template
        // of their own yet): the median is the noise's.
        for (var i = 0; i < 16; i++)
        {
            var level = 0.01 * (1 + 0.1 * (i % 3));
            floor.Add((i % 4 == 3 ? 30_000 : 300) * level * level, level);
        }

        Assert.Equal(300 * 0.02 * 0.02, floor.ResidualFor(0.02), 9);

        // A beat with no noise level, or an unmeasured residual, teaches nothing.
        floor.Add(double.NaN, 0.01);
        floor.Add(5, 0);
        Assert.Equal(300 * 0.02 * 0.02, floor.ResidualFor(0.02), 9);
    }

    private static double Gaussian(Random random) =>
        Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());

    private static double Correlation(double[] x, double[] y)
    {
        double mx = x.Average(), my = y.Average(), dot = 0, ex = 0, ey = 0;
        for (var i = 0; i < x.Length; i++)
        {
            dot += (x[i] - mx) * (y[i] - my);
            ex += (x[i] - mx) * (x[i] - mx);
            ey += (y[i] - my) * (y[i] - my);
        }

        return dot / Math.Sqrt(ex * ey);
    }
}
