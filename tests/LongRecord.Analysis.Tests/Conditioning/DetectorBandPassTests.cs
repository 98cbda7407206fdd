using LongRecord.Analysis.Conditioning;

namespace LongRecord.Analysis.Tests.Conditioning;

/// <summary>
/// The QRS detector's band-pass (5–15 Hz, second-order Butterworth: two sections, NWaves frequencies divided by the
/// sampling rate) over several leads at once through <see cref="BiquadCascade.ProcessLeads"/> — a pair, three or four
/// in four lanes, five as four and one — gives every lead's samples and state bit for bit as its own lone cascade, in
/// blocks of any size. Signals: MIT-BIH Arrhythmia Database records 207 and 208 (see <see cref="CascadeLeads"/>), held
/// samples in place of gaps as the detector feeds them, each cascade settled on its first sample as the detector
/// settles it.
/// </summary>
public sealed class DetectorBandPassTests
{
    private const double Fs = 360;

    public static TheoryData<int, int> LeadsBlocks()
    {
        var data = new TheoryData<int, int>();
        foreach (var leads in new[] { 2, 3, 4, 5 })
        {
            foreach (var block in new[] { 1, 7, 1000 })
            {
                data.Add(leads, block);
            }
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(LeadsBlocks))]
    public void ProcessLeads_EqualsEachLeadAlone(int leads, int block)
    {
        var raw = CascadeLeads.Read(leads, withGaps: false);
        var lone = raw.Select(_ => Design()).ToArray();
        var expected = raw.Select((l, k) =>
        {
            var c = (float[])l.Clone();
            lone[k].SettleAt(c[0]);
            lone[k].Process(c);
            return c;
        }).ToArray();

        var cascades = raw.Select(l =>
        {
            var c = Design();
            c.SettleAt(l[0]);
            return c;
        }).ToArray();
        Assert.Equal(2, cascades[0].Sections);
        var actual = CascadeLeads.InBlocks(raw, block, (buffer, count) => BiquadCascade.ProcessLeads(cascades, buffer, count));
        for (var k = 0; k < leads; k++)
        {
            CascadeLeads.AssertBitIdentical(expected[k], actual[k], $"lead {k} of {leads}, block {block}");
            Assert.Equal(lone[k].StateSnapshot(), cascades[k].StateSnapshot());
        }
    }

    private static BiquadCascade Design() => new(new NWaves.Filters.Butterworth.BandPassFilter(5 / Fs, 15 / Fs, 2).Tf);
}
