using LongRecord.Pipeline.Tests.Ec57;

namespace LongRecord.Pipeline.Tests.Beats;

/// <summary>Beats issue: "the same recording analysed with two different block sizes gives identical beats".</summary>
public sealed class BlockSizeInvarianceTests
{
    [Theory]
    [InlineData("mitdb", "208")]
    [InlineData("svdb", "800")]
    public void DifferentBlockSizes_IdenticalBeats(string database, string record)
    {
        var reference = RecordRun.Get(database, record, blockSamples: 1 << 16);
        foreach (var block in new[] { 1000, 7777, 1 << 20 })
        {
            var other = RecordRun.Get(database, record, blockSamples: block);
            Assert.Equal(reference.Beats.Count, other.Beats.Count);
            for (var i = 0; i < reference.Beats.Count; i++)
            {
                Assert.True(reference.Beats[i].Equals(other.Beats[i]), $"block {block}: beat {i} differs ({Describe(reference.Beats[i])} vs {Describe(other.Beats[i])})");
            }
        }
    }

    private static string Describe(LongRecord.Analysis.Beats.Beat b) =>
        $"{b.Sample} {b.Class} t{b.Template} {b.Flags} on{b.QrsOnOffset} off{b.QrsOffOffset} {b.QrsMs:R} p{b.PWave} pp{b.PPeakOffset} te{b.TEndOffset} {b.LeadQuality}";
}
