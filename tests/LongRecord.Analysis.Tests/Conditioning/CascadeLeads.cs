using LongRecord.Analysis.Tests.Support;

namespace LongRecord.Analysis.Tests.Conditioning;

/// <summary>
/// The signals and the comparison shared by the tests that run several leads' cascades in the lanes of one vector:
/// MIT-BIH Arrhythmia Database records 207 and 208 (PhysioNet, read in place), four different leads so that a lane
/// mix-up shows.
/// </summary>
internal static class CascadeLeads
{
    /// <summary>Samples per lead: the first 60 s at 360 Hz.</summary>
    public const int Samples = 60 * 360;

    // The first 60 s of four leads (207 MLII and V1, 208 MLII and V1), then the same leads inverted for leads five to
    // seven; with gaps: one at the very start of lead 1, one across many block edges on lead 2 and one on every lead.
    public static float[][] Read(int leads, bool withGaps)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(leads, 2);
        var records = new[] { ReferenceRecord.Load("mitdb", "207"), ReferenceRecord.Load("mitdb", "208") };
        var four = records.SelectMany(r => r.Leads).Select(l => l.AsSpan(0, Samples).ToArray()).ToArray();
        var result = new float[leads][];
        for (var k = 0; k < leads; k++)
        {
            result[k] = k < 4 ? (float[])four[k].Clone() : four[k - 4].Select(v => -v).ToArray();
        }

        if (withGaps)
        {
            result[1].AsSpan(0, 500).Fill(float.NaN);

            if (leads > 2)
            {
                result[2].AsSpan(3001, 2500).Fill(float.NaN);
            }

            foreach (var lead in result)
            {
                lead.AsSpan(12000, 77).Fill(float.NaN);
            }
        }

        return result;
    }

    public static void AssertBitIdentical(float[] expected, float[] actual, string what)
    {
        Assert.Equal(expected.Length, actual.Length);
        for (var i = 0; i < expected.Length; i++)
        {
            if (BitConverter.SingleToInt32Bits(expected[i]) != BitConverter.SingleToInt32Bits(actual[i]))
            {
                Assert.Fail($"{what}: sample {i} is {actual[i]:R}, alone {expected[i]:R}");
            }
        }
    }

    // The leads through process in blocks of block samples, lead-major (lead k at k × count), as the pipeline feeds them.
    public static float[][] InBlocks(float[][] raw, int block, Action<Span<float>, int> process)
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
