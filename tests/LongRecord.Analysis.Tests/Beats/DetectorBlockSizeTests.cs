using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Conditioning;
using LongRecord.Analysis.Tests.Conditioning;

namespace LongRecord.Analysis.Tests.Beats;

/// <summary>
/// The QRS detector finds the same beats whatever the block size, also when one lead begins inside a gap longer than a
/// block (the beats issue: results never depend on block size). Signal: MIT-BIH Arrhythmia Database records 207 and
/// 208, first 60 s (PhysioNet, read in place; see <see cref="CascadeLeads"/>), conditioned as the pipeline does,
/// lead 1 raised by 2 mV.
/// </summary>
public sealed class DetectorBlockSizeTests
{
    [Theory]
    [InlineData(7)]
    [InlineData(360)]
    [InlineData(1000)]
    public void LeadThatBeginsInAGap_AnyBlockSize_SameDetectionsAsOneBlock(int block)
    {
        var leads = CascadeLeads.Read(2, withGaps: false);
        // 2.5 s missing at the start of lead 1.
        leads[1].AsSpan(0, 900).Fill(float.NaN);
        var conditioned = CascadeLeads.InBlocks(leads, CascadeLeads.Samples, new LeadSetConditioner(360, 2).Process);
        // A lead that does not start near 0 mV (the detector holds a gap at the lead's first valid value; held at
        // anything else, the band-pass would meet a step there).
        foreach (ref var v in conditioned[1].AsSpan())
        {
            v += 2f;
        }

        var whole = Detect(conditioned, CascadeLeads.Samples);
        var inBlocks = Detect(conditioned, block);

        Assert.True(whole.Count > 50, $"only {whole.Count} beats in 60 s");
        Assert.Equal(whole, inBlocks);
    }

    private static List<long> Detect(float[][] conditioned, int block)
    {
        var detector = new QrsDetector(360, conditioned.Length);
        CascadeLeads.InBlocks(conditioned, block, (b, c) => detector.Process(b, c));
        detector.Flush();
        var found = new List<long>();
        detector.TakeDetections(found);
        return found;
    }
}
