using LongRecord.Analysis.Conditioning;

namespace LongRecord.Analysis.Tests.Conditioning;

/// <summary>
/// The conditioner of a lead set — two leads in the two lanes of one vector, three or four in four lanes, more in groups
/// of four and then the rest — gives every lead's samples and filter state bit for bit as that lead through its own
/// <see cref="EcgConditioner"/>, whatever the block size and with missing samples. Signals: MIT-BIH Arrhythmia Database
/// records 207 and 208 (PhysioNet, read in place; see <see cref="CascadeLeads"/>).
/// </summary>
public sealed class LeadSetConditionerTests
{
    // 360 Hz: the cascade has three sections (high-pass, 50 and 60 Hz notches); read as 128 Hz samples it has two (no
    // 60 Hz notch above 0.45 of the rate). Blocks of 1, 7 and 1000 samples (1000 crosses the cascade's work buffer).
    public static TheoryData<int, int, double> LeadsBlocksRates()
    {
        var data = new TheoryData<int, int, double>();
        foreach (var leads in new[] { 2, 3, 4, 5, 6, 7 })
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
        // Each lead alone in the same blocks (lead 1 starts inside a gap: its filter settles at its first valid sample).
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
        var actual = CascadeLeads.InBlocks(raw, block, set.Process);
        for (var k = 0; k < leads; k++)
        {
            CascadeLeads.AssertBitIdentical(expected[k], actual[k], $"lead {k} of {leads}, block {block}, {rateHz} Hz");

            // The float outputs rarely show a last-bit difference of the double arithmetic; the filter states do.
            Assert.Equal(alone[k].Filter.StateSnapshot(), set.LeadFilter(k).StateSnapshot());
        }
    }
}
