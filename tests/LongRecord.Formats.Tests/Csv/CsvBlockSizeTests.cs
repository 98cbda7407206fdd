using LongRecord.Formats.Csv;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Csv;

/// <summary>Same values whatever the block size or read order (boundary independence of the sparse row index).</summary>
public class CsvBlockSizeTests : IDisposable
{
    // More rows than several index entries (1 024 rows each), with blank lines inside to check that rows, not lines, count.
    private const int Rows = 5_003;

    private readonly TempFolder _temp = new("csv");
    private readonly string _path;

    public CsvBlockSizeTests()
    {
        var text = CsvTestText.Seconds(500, Rows, leads: 3, timeFormat: "F3");
        text = text.Replace("\n1.000,", "\n\n1.000,").Replace("\n5.000,", "\n  \n5.000,");
        _path = _temp.Write("blocks.csv", CsvTestText.Bytes(text));
    }

    public static TheoryData<int> BlockSizes => new() { 1, 7, 200, 4096, Rows };

    [Theory]
    [MemberData(nameof(BlockSizes))]
    public void SingleChannel_AnyBlockSize_MatchesText(int blockSize)
    {
        using var reader = CsvRecordingReader.Open(_path);
        Assert.Equal(Rows, reader.Info.Channels[0].SampleCount);
        var block = new float[blockSize];
        for (var lead = 0; lead < 3; lead++)
        {
            for (long start = 0; start < Rows; start += blockSize)
            {
                var count = (int)Math.Min(blockSize, Rows - start);
                reader.Read(lead, start, block.AsSpan(0, count));
                for (var i = 0; i < count; i++)
                {
                    Assert.Equal((float)CsvTestText.Value(lead, start + i), block[i]);
                }
            }
        }
    }

    [Theory]
    [MemberData(nameof(BlockSizes))]
    public void MultiChannel_AnyBlockSize_MatchesText(int blockSize)
    {
        using var reader = CsvRecordingReader.Open(_path);
        int[][] sets = [[0, 1, 2], [2, 0], [1]];
        foreach (var leads in sets)
        {
            var block = new float[leads.Length * blockSize];
            for (long start = 0; start < Rows; start += blockSize)
            {
                var count = (int)Math.Min(blockSize, Rows - start);
                reader.Read(leads, start, count, block);
                for (var k = 0; k < leads.Length; k++)
                {
                    for (var i = 0; i < count; i++)
                    {
                        Assert.Equal((float)CsvTestText.Value(leads[k], start + i), block[k * count + i]);
                    }
                }
            }
        }
    }

    [Fact]
    public void RandomPositions_BackAndForth_MatchText()
    {
        using var reader = CsvRecordingReader.Open(_path);
        var random = new Random(5);
        var block = new float[37];
        for (var n = 0; n < 300; n++)
        {
            var start = random.Next(0, Rows - block.Length);
            var lead = random.Next(0, 3);
            reader.Read(lead, start, block);
            for (var i = 0; i < block.Length; i++)
            {
                Assert.Equal((float)CsvTestText.Value(lead, start + i), block[i]);
            }
        }
    }

    // Each read continues from the previous one's end, repeats it, overlaps it by one row, or crosses an index entry
    // (1 024 rows), so every way of positioning the cursor is used.
    [Theory]
    [InlineData(0, 100, 99)]
    [InlineData(0, 100, 100)]
    [InlineData(0, 100, 0)]
    [InlineData(1000, 30, 1029)]
    [InlineData(1020, 10, 1023)]
    [InlineData(4000, 50, 1)]
    public void ReadAfterRead_AnyRelativePosition_MatchesText(int first, int length, int second)
    {
        using var reader = CsvRecordingReader.Open(_path);
        var block = new float[length];
        reader.Read(1, first, block);
        reader.Read(1, second, block);
        for (var i = 0; i < length; i++)
        {
            Assert.Equal((float)CsvTestText.Value(1, second + i), block[i]);
        }
    }

    public void Dispose() => _temp.Dispose();
}
