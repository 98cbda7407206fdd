using LongRecord.Analysis.Conditioning;

namespace LongRecord.Analysis.Tests.Conditioning;

/// <summary>
/// Three to seven leads filtered together in the lanes of one vector give every lead's samples bit for bit as the lead
/// filtered alone, whatever the block size and with missing samples. The reference is each lead through its own
/// <see cref="EcgConditioner"/> or lone <see cref="BiquadCascade"/> (the cascade whole); the signals are MIT-BIH Arrhythmia Database
/// records 207 and 208 (PhysioNet, read in place), four different leads so that a lane mix-up shows.
/// </summary>
public sealed class FourLaneCascadeTests
{
    // The conditioner of three to seven leads: LeadSetConditionerTests. Here the detector's band-pass and the kernel.
    [Theory]
    [InlineData(3, 1)]
    [InlineData(3, 7)]
    [InlineData(3, 1000)]
    [InlineData(4, 1)]
    [InlineData(4, 7)]
    [InlineData(4, 1000)]
    public void DetectorBandPass_FourLanes_EqualsEachLeadAlone(int leads, int block)
    {
        // The detector's band-pass (5–15 Hz, second-order Butterworth band-pass: two sections), NWaves frequencies
        // divided by the sampling rate. Held samples in place of gaps, as the detector feeds it.
        const double fs = 360;
        var raw = CascadeLeads.Read(leads, withGaps: false);
        BiquadCascade Design() => new(new NWaves.Filters.Butterworth.BandPassFilter(5 / fs, 15 / fs, 2).Tf);
        var lone = raw.Select(_ => Design()).ToArray();
        var expected = raw.Select((l, k) =>
        {
            var c = (float[])l.Clone();
            lone[k].SettleAt(c[0]);
            lone[k].Process(c);
            return c;
        }).ToArray();

        var cascades = Enumerable.Range(0, leads).Select(_ => Design()).ToArray();
        Assert.Equal(2, cascades[0].Sections);
        for (var k = 0; k < leads; k++)
        {
            cascades[k].SettleAt(raw[k][0]);
        }

        var n = raw[0].Length;
        var buffer = new float[leads * block];
        var actual = raw.Select(_ => new float[n]).ToArray();
        for (var start = 0; start < n; start += block)
        {
            var count = Math.Min(block, n - start);
            for (var k = 0; k < leads; k++)
            {
                raw[k].AsSpan(start, count).CopyTo(buffer.AsSpan(k * count, count));
            }

            BiquadCascade.ProcessFour(cascades, buffer, count);
            for (var k = 0; k < leads; k++)
            {
                buffer.AsSpan(k * count, count).CopyTo(actual[k].AsSpan(start, count));
            }
        }

        for (var k = 0; k < leads; k++)
        {
            CascadeLeads.AssertBitIdentical(expected[k], actual[k], $"lead {k} of {leads}, block {block}");
            Assert.Equal(lone[k].StateSnapshot(), cascades[k].StateSnapshot());
        }
    }

    [Fact]
    public void ProcessFour_RefusesOtherLaneCountsAndUnequalCascades()
    {
        var two = new[] { new EcgConditioner(360).Filter, new EcgConditioner(360).Filter };
        Assert.Throws<ArgumentException>(() => BiquadCascade.ProcessFour(two, new float[20], 10));
        var mixed = new[] { new EcgConditioner(360).Filter, new EcgConditioner(360).Filter, new EcgConditioner(128).Filter };
        Assert.Throws<ArgumentException>(() => BiquadCascade.ProcessFour(mixed, new float[30], 10));
    }
}
