using System.Globalization;
using LongRecord.Analysis.Episodes;
using Xunit.Abstractions;

namespace LongRecord.Pipeline.Tests.Episodes;

/// <summary>
/// The width of an episode's mean complex (its evidence, and the width used when the beats carry none) against the
/// synthesiser's truth (the 2 % QRS edge definition of <c>fixtures/scenarios/README.md</c>): the median true width of
/// the episode's beats. In muscle noise the mean complex must stay narrow where the beats are narrow; ± 20 ms is our
/// own tolerance (the synthesiser's 2 % edges against our 9 % slope level differ by a few ms; 12 dB noise measured
/// 130–250 ms before the threshold respected the mean's own noise).
/// </summary>
public sealed class MeanComplexWidthTests(ITestOutputHelper output)
{
    [Theory]
    [InlineData("psvt-180", null)]
    [InlineData("psvt-180", 12.0)]
    [InlineData("focal-atrial-tachycardia", 12.0)]
    [InlineData("sinus-tachycardia", 12.0)]
    public void NarrowTachycardia_MeanComplexWithin20msOfTruth(string scenario, double? snrDb)
    {
        var (rec, episodes) = SyntheticEpisodeTests.Run(scenario, snrDb);
        var tachycardia = episodes.Where(e => e.MeanBpm > 100 && e.Beats >= 10).OrderByDescending(e => e.Beats).First();
        var widths = rec.Truth.Beats.Where(b => b.RTimeS >= tachycardia.StartS && b.RTimeS <= tachycardia.EndS).Select(b => b.QrsWidthMs).Order().ToList();
        var truth = widths[widths.Count / 2];
        var measured = tachycardia.Atrial.MeanComplexQrsMs;
        var line = string.Create(CultureInfo.InvariantCulture,
            $"{scenario} {(snrDb is double s ? $"{s} dB" : "no noise")}: {tachycardia.Kind} {tachycardia.StartS:0.0}-{tachycardia.EndS:0.0} s, mean complex {measured:0} ms, truth median {truth:0} ms");
        output.WriteLine(line);
        Assert.True(Math.Abs(measured - truth) <= 20, line);
    }
}
