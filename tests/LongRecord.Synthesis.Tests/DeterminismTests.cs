using LongRecord.Synthesis.Truth;

namespace LongRecord.Synthesis.Tests;

/// <summary>Reproducibility (the criteria): same seed → same samples and truth; any block split → same samples.</summary>
public sealed class DeterminismTests
{
    private static byte[] TruthJson(SyntheticRecording rec)
    {
        using var stream = new MemoryStream();
        TruthDocument.From(rec).Write(stream);
        return stream.ToArray();
    }

    [Theory]
    [InlineData("noise-motion")]
    [InlineData("vf-vfl")]
    [InlineData("af")]
    public void SameSeed_IdenticalSamplesAndTruth_OtherSeedDiffers(string scenario)
    {
        var a = ScenarioFiles.Recording(scenario);
        var b = ScenarioFiles.Recording(scenario);
        var c = ScenarioFiles.Recording(scenario, seed: a.Seed + 1);
        var sa = SignalProbe.Render(a, 0, (int)a.SampleCount);
        var sb = SignalProbe.Render(b, 0, (int)b.SampleCount);
        var sc = SignalProbe.Render(c, 0, (int)c.SampleCount);
        for (var k = 0; k < sa.Length; k++)
        {
            Assert.Equal(sa[k], sb[k]);
            Assert.NotEqual(sa[k], sc[k]);
        }

        Assert.Equal(TruthJson(a), TruthJson(b));
        Assert.NotEqual(a.Truth.Beats.Select(x => x.RTimeS), c.Truth.Beats.Select(x => x.RTimeS));
    }

    [Theory]
    [InlineData("noise-motion", 15.0, 80.0)]
    [InlineData("vf-vfl", 15.0, 60.0)]
    [InlineData("flutter-variable", 25.0, 45.0)]
    [InlineData("broad-tachycardia", 35.0, 55.0)]
    public void AnyBlockSize_GivesTheSameSamples(string scenario, double fromS, double toS)
    {
        var rec = ScenarioFiles.Recording(scenario);
        var start = (long)(fromS * rec.SamplingRateHz);
        var count = (int)((toS - fromS) * rec.SamplingRateHz);
        var whole = SignalProbe.Render(rec, start, count);
        foreach (var block in new[] { 1, 7, 1000, 65536 })
        {
            var leads = rec.Leads.Count;
            var pieced = Enumerable.Range(0, leads).Select(_ => new float[count]).ToArray();
            var buffer = new float[leads * block];
            for (var done = 0; done < count; done += block)
            {
                var n = Math.Min(block, count - done);
                rec.Render(start + done, n, buffer);
                for (var k = 0; k < leads; k++)
                {
                    buffer.AsSpan(k * n, n).CopyTo(pieced[k].AsSpan(done));
                }
            }

            for (var k = 0; k < leads; k++)
            {
                Assert.True(whole[k].AsSpan().SequenceEqual(pieced[k]), $"block size {block}, lead {k} differs");
            }
        }
    }

    [Fact]
    public void Render_RejectsRangesOutsideTheRecording()
    {
        var rec = ScenarioFiles.Recording("sinus-rest");
        var buffer = new float[2 * 10];
        Assert.Throws<ArgumentOutOfRangeException>(() => rec.Render(-1, 10, buffer));
        Assert.Throws<ArgumentOutOfRangeException>(() => rec.Render(rec.SampleCount - 5, 10, buffer));
        Assert.Throws<ArgumentException>(() => rec.Render(0, 11, buffer));
    }
}
