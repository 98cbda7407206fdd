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
    // The conditioner of two and six leads (a pair; a group of four and a pair): LeadSetConditionerTests; the
    // detector's band-pass: DetectorBandPassTests.
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
