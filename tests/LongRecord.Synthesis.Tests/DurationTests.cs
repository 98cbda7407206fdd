namespace LongRecord.Synthesis.Tests;

/// <summary>The <c>hours</c> option (issue criteria): exact duration, timeline repeated or cut, every truth item inside.</summary>
public sealed class DurationTests
{
    private static void AssertTruthInside(SyntheticRecording rec)
    {
        Assert.All(rec.Truth.Beats, b =>
        {
            Assert.True(b.QrsOnsetS >= 0 && b.TEndS < rec.DurationS, $"beat at {b.RTimeS} s outside 0…{rec.DurationS} s");
            Assert.True(b.PPeakS is null || b.PPeakS >= 0);
            Assert.InRange(b.RSample, 0, rec.SampleCount - 1);
        });
        Assert.All(rec.Truth.Rhythms, r => Assert.True(r.StartS >= 0 && r.EndS <= rec.DurationS && r.StartS <= r.EndS, $"{r.Kind} {r.StartS}…{r.EndS}"));
        Assert.All(rec.Truth.Noise, n => Assert.True(n.StartSample >= 0 && n.EndSample <= rec.SampleCount));
    }

    [Fact]
    public void Hours_RepeatsShortTimelineCyclically()
    {
        var rec = ScenarioFiles.Recording("vf-vfl", rateHz: 360, hours: 0.1);
        Assert.Equal(360.0, rec.DurationS);
        Assert.Equal(360L * 360, rec.SampleCount);
        var cycle = rec.Scenario.TimelineDurationS;
        var flutters = rec.Truth.Rhythms.Where(r => r.Kind == "ventricular-flutter").ToList();
        Assert.Equal((int)Math.Ceiling((360 - 20) / cycle), flutters.Count);
        Assert.Equal(cycle, flutters[1].StartS - flutters[0].StartS, 9);
        AssertTruthInside(rec);
    }

    [Fact]
    public void Hours_CutsLongTimelineExactly()
    {
        var rec = ScenarioFiles.Recording("demo-24h", hours: 0.75);
        Assert.Equal(2700.0, rec.DurationS);
        Assert.Equal(2700L * 250, rec.SampleCount);
        AssertTruthInside(rec);
        var last = rec.Truth.Beats[^1];
        Assert.True(rec.DurationS - last.RTimeS < 2.0, $"last beat {last.RTimeS} s");
    }

    [Fact]
    public void WholeDemo_TwentyFourHoursWithTheDaysEvents()
    {
        var rec = ScenarioFiles.Recording("demo-24h");
        Assert.Equal(86400.0, rec.DurationS);
        AssertTruthInside(rec);
        var counts = rec.Truth.Beats.GroupBy(b => b.Class).ToDictionary(g => g.Key, g => g.Count());
        Assert.InRange(counts[Truth.BeatClass.V], 200, 5000);
        Assert.InRange(counts[Truth.BeatClass.S], 200, 5000);
        var af = rec.Truth.Rhythms.Single(r => r.Kind == "af");
        Assert.InRange(af.DurationS, 38 * 60, 42 * 60);
        Assert.Contains(rec.Truth.Rhythms, r => r.Kind == "pause" && r.DurationS is > 2 and < 3);
        Assert.Contains(rec.Truth.Rhythms, r => r.Kind == "ve-couplet");
        Assert.Contains(rec.Truth.Rhythms, r => r.Kind == "ve-run");
        Assert.Contains(rec.Truth.Noise, n => n.Kind == "lead-off");
    }
}
