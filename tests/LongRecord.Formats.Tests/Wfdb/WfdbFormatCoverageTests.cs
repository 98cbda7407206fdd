using System.Text;
using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>
/// Each signal(5) format: known stored values, encoded by hand (<see cref="WfdbHandEncoder"/>), read back. Gain 1 and
/// baseline 0, so the physical value equals the stored one.
/// </summary>
public class WfdbFormatCoverageTests
{
    public static TheoryData<int, int> Cases()
    {
        var data = new TheoryData<int, int>();
        foreach (var format in new[] { 8, 16, 24, 32, 61, 80, 160, 212, 310, 311 })
        {
            // 1, 2 and 3 signals over 7 frames: streams of 7, 14, 21 values leave every possible partial last group of
            // the bit-packed formats (212: 1 of 2; 310/311: 1 or 2 of 3).
            foreach (var signals in new[] { 1, 2, 3 })
            {
                data.Add(format, signals);
            }
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void HandEncodedValues_ReadBack(int format, int signals)
    {
        const int frames = 7;
        var (min, max, invalid) = Range(format);
        var rng = new Random(format * 10 + signals);
        var stream = new int[frames * signals];
        for (var i = 0; i < stream.Length; i++)
        {
            stream[i] = format == 8 ? 0 : rng.Next(min, max) + (rng.Next(2) == 0 ? 0 : 1);
        }

        if (format == 8)
        {
            // Differences of at most ±127 from a start of 100 per signal.
            for (var i = signals; i < stream.Length; i++)
            {
                stream[i] = stream[i - signals] + rng.Next(-127, 128);
            }

            for (var i = 0; i < stream.Length; i++)
            {
                stream[i] += 100;
            }
        }
        else
        {
            stream[0] = min;
            stream[^1] = max;
            if (invalid is int v && stream.Length > 2)
            {
                stream[1] = v;
            }
        }

        var initial = Enumerable.Range(0, signals).Select(s => stream[s]).ToArray();
        using var folder = new TempFolder("wfdb-format");
        folder.Write("rec.dat", WfdbHandEncoder.Encode(format, stream, Enumerable.Range(0, signals).ToArray(), initial));
        var header = new StringBuilder($"rec {signals} 250 {frames}\n");
        for (var s = 0; s < signals; s++)
        {
            header.Append($"rec.dat {format} 1(0)/mV 0 0 {initial[s]} 0 0 signal {s}\n");
        }

        folder.Write("rec.hea", Encoding.ASCII.GetBytes(header.ToString()));
        using var reader = WfdbRecordReader.Open(folder.Path("rec.hea"));
        Assert.Equal($"WFDB (format {format})", reader.Info.FormatDetail);
        var got = new float[signals * frames];
        reader.Read(Enumerable.Range(0, signals).ToArray(), 0, frames, got);
        for (var s = 0; s < signals; s++)
        {
            for (var f = 0; f < frames; f++)
            {
                var stored = stream[f * signals + s];
                var expected = format != 8 && stored == invalid ? float.NaN : (float)stored;
                Assert.Equal(expected, got[s * frames + f]);
            }
        }
    }

    [Fact]
    public void ByteOffset_SkipsPreamble()
    {
        // header(5) "+byte offset": bytes before sample 0 are not samples.
        using var folder = new TempFolder("wfdb-offset");
        var stream = new[] { 1, -2, 300, -400, 5000, -6000 };
        folder.Write("rec.dat", [.. new byte[] { 0xAA, 0xBB, 0xCC, 0xDD, 0xEE }, .. WfdbHandEncoder.Encode(16, stream)]);
        folder.Write("rec.hea", Encoding.ASCII.GetBytes("rec 2 100 3\nrec.dat 16+5 1 16 0 1 0 0 a\nrec.dat 16+5 1 16 0 -2 0 0 b\n"));
        using var reader = WfdbRecordReader.Open(folder.Path("rec"));
        var got = new float[6];
        reader.Read([0, 1], 0, 3, got);
        Assert.Equal([1f, 300f, 5000f, -2f, -400f, -6000f], got);
    }

    [Fact]
    public void Units_MicrovoltsReturnMillivolts_OtherUnitsAsWritten()
    {
        // ChannelInfo contract: voltages in millivolts; header(5): physical = (digital − baseline) / gain in the
        // signal's units. 250 − 50 = 200 units at gain 100 → 2 units: 2 µV = 0.002 mV; 2 mmHg stays 2.
        using var folder = new TempFolder("wfdb-units");
        folder.Write("rec.dat", WfdbHandEncoder.Encode(16, [250, 250]));
        folder.Write("rec.hea", Encoding.ASCII.GetBytes("rec 2 100 1\nrec.dat 16 100(50)/uV 16 0\nrec.dat 16 100(50)/mmHg 16 0\n"));
        using var reader = WfdbRecordReader.Open(folder.Path("rec.hea"));
        var got = new float[2];
        reader.Read([0, 1], 0, 1, got);
        Assert.Equal(0.002, got[0], 1e-9);
        Assert.Equal(2.0, got[1], 1e-9);
        Assert.False(reader.Info.Channels[1].IsVoltage);
    }

    private static (int Min, int Max, int? Invalid) Range(int format) => format switch
    {
        8 => (0, 0, null),
        16 or 61 or 160 => (-32767, 32767, -32768),
        24 => (-(1 << 23) + 1, (1 << 23) - 1, -(1 << 23)),
        // Float holds integers exactly up to 2^24; larger 32-bit values are checked in their float rounding.
        32 => (int.MinValue + 1, int.MaxValue, int.MinValue),
        80 => (-127, 127, -128),
        212 => (-2047, 2047, -2048),
        310 or 311 => (-511, 511, -512),
        _ => throw new ArgumentOutOfRangeException(nameof(format)),
    };
}
