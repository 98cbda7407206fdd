using LongRecord.Analysis.Conditioning;

namespace LongRecord.Analysis.Tests.Conditioning;

/// <summary>
/// One lead's conditioning gives the same samples, bit for bit, whatever the block size — also for a recording that
/// begins inside a gap longer than a block (the beats issue: results never depend on block size). Signal: MIT-BIH
/// Arrhythmia Database record 208, lead 1 (PhysioNet, read in place; see <see cref="CascadeLeads"/>).
/// </summary>
public sealed class ConditionerBlockSizeTests
{
    [Theory]
    [InlineData(1)]
    [InlineData(7)]
    [InlineData(360)]
    [InlineData(1000)]
    public void RecordingThatBeginsInAGap_AnyBlockSize_SameSamplesAsOneBlock(int block)
    {
        var lead = CascadeLeads.Read(2, withGaps: false)[1];
        // 2.5 s missing at the start: longer than every block size here but the whole recording.
        lead.AsSpan(0, 900).Fill(float.NaN);

        var whole = (float[])lead.Clone();
        new EcgConditioner(360).Process(whole);

        var inBlocks = (float[])lead.Clone();
        var conditioner = new EcgConditioner(360);
        for (var start = 0; start < inBlocks.Length; start += block)
        {
            conditioner.Process(inBlocks.AsSpan(start, Math.Min(block, inBlocks.Length - start)));
        }

        Assert.True(float.IsNaN(inBlocks[0]) && float.IsNaN(inBlocks[899]), "missing samples stay missing");
        CascadeLeads.AssertBitIdentical(whole, inBlocks, $"blocks of {block}");
    }
}
