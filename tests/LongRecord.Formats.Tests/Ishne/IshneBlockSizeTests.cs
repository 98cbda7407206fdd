using LongRecord.Formats.Ishne;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Ishne;

/// <summary>The same samples come back whatever the block size, single- or multi-channel (boundary independence).</summary>
public class IshneBlockSizeTests : IDisposable
{
    // Three leads so the multi-channel path is the general one, and more frames than one 128 KiB read buffer holds.
    private const int SampleCount = 30_001;

    private readonly TempFolder _temp = new("ishne");
    private readonly string _path;
    private readonly short[] _digital;

    public IshneBlockSizeTests()
    {
        var random = new Random(3);
        _digital = new short[SampleCount * 3];
        for (var i = 0; i < _digital.Length; i++)
        {
            _digital[i] = (short)random.Next(-32768, 32768);
        }

        var bytes = new IshneFileBuilder
        {
            LeadCodes = [5, 6, 11],
            Resolutions = [1000, 2500, 3000],
            Qualities = [1, 1, 1],
            Samples = _digital,
        }.Build();
        _path = _temp.Write("blocks.ecg", bytes);
    }

    public static TheoryData<int> BlockSizes => new() { 1, 7, 200, 4096, SampleCount };

    [Theory]
    [MemberData(nameof(BlockSizes))]
    public void SingleChannel_AnyBlockSize_MatchesStoredSamples(int blockSize)
    {
        using var reader = IshneReader.Open(_path);
        for (var lead = 0; lead < 3; lead++)
        {
            var all = ReadInBlocks(blockSize, (start, block) => reader.Read(lead, start, block));
            AssertMatches(lead, reader.Header.Leads[lead].ResolutionNv, all);
        }
    }

    [Theory]
    [MemberData(nameof(BlockSizes))]
    public void MultiChannel_AnyBlockSize_MatchesStoredSamples(int blockSize)
    {
        using var reader = IshneReader.Open(_path);
        int[][] sets = [[0, 1, 2], [2, 0], [1]];
        foreach (var leads in sets)
        {
            var result = new float[leads.Length][];
            for (var k = 0; k < leads.Length; k++)
            {
                result[k] = new float[SampleCount];
            }

            var buffer = new float[leads.Length * blockSize];
            for (long start = 0; start < SampleCount; start += blockSize)
            {
                var count = (int)Math.Min(blockSize, SampleCount - start);
                reader.Read(leads, start, count, buffer);
                for (var k = 0; k < leads.Length; k++)
                {
                    Array.Copy(buffer, k * count, result[k], start, count);
                }
            }

            for (var k = 0; k < leads.Length; k++)
            {
                AssertMatches(leads[k], reader.Header.Leads[leads[k]].ResolutionNv, result[k]);
            }
        }
    }

    public void Dispose() => _temp.Dispose();

    private static float[] ReadInBlocks(int blockSize, Action<long, Span<float>> read)
    {
        var all = new float[SampleCount];
        for (long start = 0; start < SampleCount; start += blockSize)
        {
            var count = (int)Math.Min(blockSize, SampleCount - start);
            read(start, all.AsSpan((int)start, count));
        }

        return all;
    }

    private void AssertMatches(int lead, short resolutionNv, float[] values)
    {
        for (var i = 0; i < SampleCount; i++)
        {
            var stored = _digital[i * 3 + lead];
            if (stored == short.MinValue)
            {
                Assert.True(float.IsNaN(values[i]), $"lead {lead} sample {i} should be NaN");
                continue;
            }

            // Float product of sample and resolution: relative error below 1e-6.
            var expected = stored * resolutionNv * 1e-6;
            Assert.True(Math.Abs(values[i] - expected) <= 1e-6 * Math.Abs(expected) + 1e-9, $"lead {lead} sample {i}: {values[i]} vs {expected}");
        }
    }
}
