using System.Text;
using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>
/// The same samples whatever the block size (style anchors §7.8): records written by hand in a temporary folder are
/// read in blocks of 1, 7, 360, 4096 and whole, single- and multi-channel, and compared with the values written.
/// </summary>
public class WfdbBlockSizeInvarianceTests
{
    private static readonly int[] s_blocks = [1, 7, 360, 4096, int.MaxValue];

    public static TheoryData<string> Records() => ["format212", "format16", "multifile"];

    [Theory]
    [MemberData(nameof(Records))]
    public void AnyBlockSize_GivesTheWrittenSamples(string kind)
    {
        using var folder = new TempFolder("wfdb-blocks");
        var expected = Write(folder, kind);
        using var reader = WfdbRecordReader.Open(folder.Path("rec.hea"));

        // Channels grouped by rate, in unusual orders too, so one multi-channel read mixes files and slots.
        var byRate = Enumerable.Range(0, reader.Info.Channels.Count).GroupBy(c => reader.Info.Channels[c].SamplingRateHz).Select(g => g.ToArray()).ToList();
        foreach (var group in byRate.Concat(byRate.Select(g => g.Reverse().ToArray())))
        {
            var n = reader.Info.Channels[group[0]].SampleCount;
            foreach (var (start, end) in new[] { (0L, n), (13L, n - 16) })
            {
                var count = (int)(end - start);
                foreach (var block in s_blocks)
                {
                    var multi = new float[group.Length * count];
                    var single = new float[count];
                    var part = new float[group.Length * Math.Min(block, count)];
                    for (var s = start; s < end; s += block)
                    {
                        var len = (int)Math.Min(block, end - s);
                        reader.Read(group, s, len, part);
                        for (var k = 0; k < group.Length; k++)
                        {
                            part.AsSpan(k * len, len).CopyTo(multi.AsSpan(k * count + (int)(s - start)));
                        }
                    }

                    for (var k = 0; k < group.Length; k++)
                    {
                        for (var s = start; s < end; s += block)
                        {
                            var len = (int)Math.Min(block, end - s);
                            reader.Read(group[k], s, single.AsSpan((int)(s - start), len));
                        }

                        var want = expected[group[k]].AsSpan((int)start, count);
                        Assert.True(want.SequenceEqual(multi.AsSpan(k * count, count)), $"{kind} channel {group[k]} multi-channel, blocks of {block}, from {start}");
                        Assert.True(want.SequenceEqual(single), $"{kind} channel {group[k]} single-channel, blocks of {block}, from {start}");
                    }
                }
            }
        }
    }

    /// <summary>Writes the record and returns each channel's expected physical values.</summary>
    private static float[][] Write(TempFolder folder, string kind)
    {
        const int frames = 1001;
        var rng = new Random(kind.Length);
        return kind switch
        {
            "format212" => WriteFile(folder, "rec.dat", 212, [1, 1], frames, rng, 2047, -2048, "rec 2 360 1001\n", "200(1024)"),
            "format16" => WriteFile(folder, "rec.dat", 16, [1, 1, 1], frames, rng, 32767, -32768, "rec 3 250 1001\n", "100"),
            _ => WriteMultiFile(folder, frames, rng),
        };
    }

    private static float[][] WriteMultiFile(TempFolder folder, int frames, Random rng)
    {
        // a.dat: format 16, signal 0 with 2 samples per frame and signal 1 with 1 (frames of 3 values).
        // b.dat: format 212, signals 2 and 3. c.dat: format 311, signal 4 with 2 samples per frame, so groups of three
        // values straddle frames.
        var a = WriteFile(folder, "a.dat", 16, [2, 1], frames, rng, 32767, -32768, "", "200");
        var b = WriteFile(folder, "b.dat", 212, [1, 1], frames, rng, 2047, -2048, "", "200(1024)");
        var c = WriteFile(folder, "c.dat", 311, [2], frames, rng, 511, -512, "", "50");
        var header = $"rec 5 100 {frames}\n" + File.ReadAllText(folder.Path("a.dat.lines")) + File.ReadAllText(folder.Path("b.dat.lines")) + File.ReadAllText(folder.Path("c.dat.lines"));
        folder.Write("rec.hea", Encoding.ASCII.GetBytes(header));
        return [.. a, .. b, .. c];
    }

    private static float[][] WriteFile(TempFolder folder, string name, int format, int[] spf, int frames, Random rng, int max, int invalid, string recordLine, string gainField)
    {
        var frameSize = spf.Sum();
        var stream = new int[frames * frameSize];
        for (var i = 0; i < stream.Length; i++)
        {
            stream[i] = rng.Next(100) == 0 ? invalid : rng.Next(-max, max + 1);
        }

        folder.Write(name, WfdbHandEncoder.Encode(format, stream));
        var gain = double.Parse(gainField.Split('(')[0], System.Globalization.CultureInfo.InvariantCulture);
        var baseline = gainField.Contains('(') ? int.Parse(gainField.Split('(', ')')[1], System.Globalization.CultureInfo.InvariantCulture) : 0;
        var lines = new StringBuilder();
        var channels = new float[spf.Length][];
        var slot = 0;
        for (var s = 0; s < spf.Length; s++)
        {
            var spfText = spf[s] > 1 ? $"x{spf[s]}" : "";
            lines.Append($"{name} {format}{spfText} {gainField} 12 0 0 0 0 {name} signal {s}\n");
            channels[s] = new float[frames * spf[s]];
            for (var f = 0; f < frames; f++)
            {
                for (var k = 0; k < spf[s]; k++)
                {
                    var v = stream[f * frameSize + slot + k];
                    channels[s][f * spf[s] + k] = v == invalid ? float.NaN : (float)((v - baseline) / gain);
                }
            }

            slot += spf[s];
        }

        if (recordLine.Length > 0)
        {
            folder.Write("rec.hea", Encoding.ASCII.GetBytes(recordLine + lines));
        }
        else
        {
            folder.Write(name + ".lines", Encoding.ASCII.GetBytes(lines.ToString()));
        }

        return channels;
    }
}
