using LongRecord.Analysis.Conditioning;

namespace LongRecord.Analysis.Tests.Conditioning;

/// <summary>
/// Two leads filtered together in the two lanes of one vector (<see cref="BiquadCascade.ProcessWith"/>) give every
/// lead's samples and filter state bit for bit as the lead filtered alone, whatever the block size and with missing
/// samples. The reference is each lead through its own <see cref="EcgConditioner"/> or lone <see cref="BiquadCascade"/>;
/// the signals are MIT-BIH Arrhythmia Database records 207 and 208 (PhysioNet, read in place; see
/// <see cref="CascadeLeads"/>).
/// </summary>
public sealed class TwoLaneCascadeTests
{
    // The conditioner of two and six leads (a pair; a group of four and a pair): LeadSetConditionerTests. Here the
    // detector's band-pass and the kernel.
    [Theory]
    [InlineData(1)]
    [InlineData(7)]
    [InlineData(1000)]
    public void DetectorBandPass_TwoLanes_EqualsEachLeadAlone(int block)
    {
        // The detector's band-pass (5–15 Hz, second-order Butterworth band-pass: two sections), NWaves frequencies
        // divided by the sampling rate, settled on the first sample as the detector settles it. Held samples in place of
        // gaps, as the detector feeds it; leads 0 and 3 (207 MLII, 208 V1), the most unlike pair.
        const double fs = 360;
        var four = CascadeLeads.Read(4, withGaps: false);
        var raw = new[] { four[0], four[3] };
        BiquadCascade Design() => new(new NWaves.Filters.Butterworth.BandPassFilter(5 / fs, 15 / fs, 2).Tf);
        var lone = raw.Select(_ => Design()).ToArray();
        var expected = raw.Select((l, k) =>
        {
            var c = (float[])l.Clone();
            lone[k].SettleAt(c[0]);
            lone[k].Process(c);
            return c;
        }).ToArray();

        var first = Design();
        var second = Design();
        Assert.Equal(2, first.Sections);
        first.SettleAt(raw[0][0]);
        second.SettleAt(raw[1][0]);
        var actual = CascadeLeads.InBlocks(raw, block, (buffer, count) => first.ProcessWith(second, buffer[..count], buffer.Slice(count, count)));
        CascadeLeads.AssertBitIdentical(expected[0], actual[0], $"first lane, block {block}");
        CascadeLeads.AssertBitIdentical(expected[1], actual[1], $"second lane, block {block}");
        Assert.Equal(lone[0].StateSnapshot(), first.StateSnapshot());
        Assert.Equal(lone[1].StateSnapshot(), second.StateSnapshot());
    }

    [Fact]
    public void ProcessWith_MissingSampleInOneLane_LeavesTheOtherAlone()
    {
        // A NaN fed straight to the cascade (no holding) ruins its own lane from there on, and only its own.
        const double fs = 360;
        var four = CascadeLeads.Read(4, withGaps: false);
        var x = (float[])four[0].Clone();
        var y = (float[])four[1].Clone();
        x[CascadeLeads.Samples - 1000] = float.NaN;
        var expected = (float[])y.Clone();
        var lone = new EcgConditioner(fs).Filter;
        lone.Process(expected);

        var first = new EcgConditioner(fs).Filter;
        var second = new EcgConditioner(fs).Filter;
        Assert.Equal(3, first.Sections);
        first.ProcessWith(second, x, y);
        CascadeLeads.AssertBitIdentical(expected, y, "second lane beside a NaN");
        Assert.Equal(lone.StateSnapshot(), second.StateSnapshot());
        Assert.True(float.IsNaN(x[^1]));
        Assert.False(float.IsNaN(x[CascadeLeads.Samples - 1001]));
    }

    [Fact]
    public void ProcessWith_RefusesUnequalCascadesAndLengths()
    {
        var three = new EcgConditioner(360).Filter;
        var two = new EcgConditioner(128).Filter;
        Assert.Throws<ArgumentException>(() => three.ProcessWith(two, new float[10], new float[10]));
        Assert.Throws<ArgumentException>(() => three.ProcessWith(new EcgConditioner(360).Filter, new float[10], new float[9]));
    }
}
