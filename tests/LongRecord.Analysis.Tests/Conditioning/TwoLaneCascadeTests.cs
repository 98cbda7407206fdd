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
    // 360 Hz: the conditioner's cascade has three sections (high-pass, 50 and 60 Hz notches); read as 128 Hz samples it
    // has two (no 60 Hz notch above 0.45 of the rate). Two leads are one pair; six are a group of four and a pair.
    // Blocks of 1, 7 and 1000 samples (1000 crosses the cascade's 512-sample work buffer).
    public static TheoryData<int, int, double> LeadsBlocksRates()
    {
        var data = new TheoryData<int, int, double>();
        foreach (var leads in new[] { 2, 6 })
        {
            foreach (var block in new[] { 1, 7, 1000 })
            {
                foreach (var rate in new[] { 360.0, 128.0 })
                {
                    data.Add(leads, block, rate);
                }
            }
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(LeadsBlocksRates))]
    public void LeadSet_AnyBlockSize_EqualsEachLeadAlone(int leads, int block, double rateHz)
    {
        var raw = CascadeLeads.Read(leads, withGaps: true);
        var alone = raw.Select(_ => new EcgConditioner(rateHz)).ToArray();
        var expected = raw.Select((l, k) =>
        {
            var c = (float[])l.Clone();
            for (var start = 0; start < c.Length; start += block)
            {
                alone[k].Process(c.AsSpan(start, Math.Min(block, c.Length - start)));
            }

            return c;
        }).ToArray();

        var set = new LeadSetConditioner(rateHz, leads);
        var actual = InBlocks(raw, block, set.Process);
        for (var k = 0; k < leads; k++)
        {
            CascadeLeads.AssertBitIdentical(expected[k], actual[k], $"lead {k} of {leads}, block {block}, {rateHz} Hz");
            Assert.Equal(alone[k].Filter.StateSnapshot(), set.LeadFilter(k).StateSnapshot());
        }
    }

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
        var actual = InBlocks(raw, block, (buffer, count) => first.ProcessWith(second, buffer[..count], buffer.Slice(count, count)));
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

    // The leads through process in blocks of block samples, lead-major (lead k at k × count), as the pipeline feeds them.
    private static float[][] InBlocks(float[][] raw, int block, Action<Span<float>, int> process)
    {
        var leads = raw.Length;
        var n = raw[0].Length;
        var buffer = new float[leads * block];
        var result = raw.Select(_ => new float[n]).ToArray();
        for (var start = 0; start < n; start += block)
        {
            var count = Math.Min(block, n - start);
            for (var k = 0; k < leads; k++)
            {
                raw[k].AsSpan(start, count).CopyTo(buffer.AsSpan(k * count, count));
            }

            process(buffer, count);
            for (var k = 0; k < leads; k++)
            {
                buffer.AsSpan(k * count, count).CopyTo(result[k].AsSpan(start, count));
            }
        }

        return result;
    }
}
