using LongRecord.Formats.Edf;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Edf;

/// <summary>
/// Samples must not depend on how a caller cuts its reads (common practice, no source; the same property the
/// System.Text.Json reader tests check by re-reading input split at every index). Compared bit for bit.
/// </summary>
public sealed class EdfBlockSizeTests : IDisposable
{
    private readonly TempFolder _folder = new("edf-blocks");

    public void Dispose() => _folder.Dispose();

    public static TheoryData<int, long> Cuts()
    {
        var data = new TheoryData<int, long>();
        foreach (var block in new[] { 1, 7, 250, 4096, int.MaxValue })
        {
            foreach (var start in new long[] { 0, 123 })
            {
                data.Add(block, start);
            }
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(Cuts))]
    public void ContinuousFile_AnyBlockSize_GivesIdenticalSamples(int block, long start)
    {
        var path = _folder.Path("c.edf");
        EdfTestSignals.Write(path, EdfTestSignals.ThreeLeads(), EdfRoundTripTests.ThreeLeadSignals(), 1000);
        using var reader = EdfReader.Open(path);
        Check(reader, [0, 1, 2], block, start);
    }

    [Theory]
    [MemberData(nameof(Cuts))]
    public void DiscontinuousFile_AnyBlockSize_GivesIdenticalSamples(int block, long start)
    {
        // Records at 0, 1, 2, 5, 6, 10 s: two gaps that blocks cross in every possible place.
        var onsets = new[] { 0, 1, 2, 5, 6, 10 };
        var records = onsets.Select((o, r) => new EdfHandAssembly.DataRecord(
            [Enumerable.Range(r * 1000, 300).Select(v => (short)v).ToArray(), Enumerable.Range(-r * 1000, 300).Select(v => (short)v).ToArray()],
            $"+{o}\u0014\u0014\0")).ToArray();
        var bytes = EdfHandAssembly.Build("EDF+D", "01.02.24", "10.00.00", "1",
            [new("A", 300), new("B", 300), new("EDF Annotations", 8)], records);
        using var reader = EdfReader.Open(_folder.Write("d.edf", bytes));
        Assert.Equal(2, reader.Info.Gaps.Count);
        Check(reader, [0, 1], block, start);
    }

    private static void Check(EdfReader reader, int[] channels, int block, long start)
    {
        var n = reader.Info.Channels[channels[0]].SampleCount;
        var whole = channels.Select(c =>
        {
            var x = new float[n];
            reader.Read(c, 0, x);
            return x;
        }).ToArray();

        var size = (int)Math.Min(block, n - start);
        var multi = new float[channels.Length * size];
        var single = new float[size];
        for (var s = start; s < n; s += size)
        {
            var count = (int)Math.Min(size, n - s);
            reader.Read(channels, s, count, multi);
            for (var k = 0; k < channels.Length; k++)
            {
                reader.Read(channels[k], s, single.AsSpan(0, count));
                for (var i = 0; i < count; i++)
                {
                    var expected = BitConverter.SingleToInt32Bits(whole[k][s + i]);
                    Assert.Equal(expected, BitConverter.SingleToInt32Bits(single[i]));
                    Assert.Equal(expected, BitConverter.SingleToInt32Bits(multi[k * count + i]));
                }
            }
        }
    }
}
