using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>Checks that compare what the reader returns with values PhysioNet wrote into its own files.</summary>
internal static class WfdbReferenceChecks
{
    /// <summary>Header paths (record paths without <c>.hea</c>) of the records a database folder lists.</summary>
    public static IEnumerable<string> RecordPaths(string database) =>
        SharedData.Records(database).Select(r => Path.Combine(SharedData.Physionet(database), r));

    /// <summary>
    /// Reads every sample of every channel in blocks and checks, per signal, the header's checksum field ("a 16-bit
    /// signed checksum of all samples", header(5)) and its initial value (the first sample; header(5) example 1, and
    /// the PhysioNet headers of these databases write it for amplitude formats too). Returns the samples read.
    /// </summary>
    public static long AssertSamplesMatchHeaderChecksums(WfdbRecordReader reader)
    {
        var info = reader.Info;
        var n = info.Channels[0].SampleCount;
        var channels = Enumerable.Range(0, info.Channels.Count).ToArray();
        const int block = 1 << 16;
        var buffer = new float[channels.Length * block];
        var sums = new long[channels.Length];
        var first = new int[channels.Length];
        for (long s = 0; s < n; s += block)
        {
            var count = (int)Math.Min(block, n - s);
            reader.Read(channels, s, count, buffer);
            for (var c = 0; c < channels.Length; c++)
            {
                var ch = info.Channels[c];
                var invalid = InvalidValue(reader.Header.Signals[c].Format);
                var span = buffer.AsSpan(c * count, count);
                for (var i = 0; i < span.Length; i++)
                {
                    var digital = float.IsNaN(span[i]) ? invalid : (int)Math.Round(span[i] / ch.MillivoltsPerUnit * ch.Gain + ch.Baseline);
                    sums[c] += digital;
                    if (s == 0 && i == 0)
                    {
                        first[c] = digital;
                    }
                }
            }
        }

        for (var c = 0; c < channels.Length; c++)
        {
            var spec = reader.Header.Signals[c];
            Assert.True(spec.Checksum.HasValue, $"{info.FilePath} signal {c} has no checksum field");
            Assert.Equal(spec.Checksum!.Value, (int)(short)(sums[c] & 0xFFFF));
            Assert.Equal(spec.InitialValue, first[c]);
        }

        return n * channels.Length;
    }

    // signal(5) gives no invalid value; bemoody/wfdb issue #11: the WFDB library reads the lowest value of formats
    // narrower than 16 bits, and −32768 for 16 bits, as invalid.
    private static int InvalidValue(int format) => format switch
    {
        212 => -2048,
        16 or 61 or 160 => -32768,
        _ => throw new ArgumentOutOfRangeException(nameof(format), format, "no reference database uses this format"),
    };
}
