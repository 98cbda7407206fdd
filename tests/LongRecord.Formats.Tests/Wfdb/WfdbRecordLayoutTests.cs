using System.Text;
using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>Record layouts header(5) allows: unspecified length, absent files, difference format read out of order.</summary>
public class WfdbRecordLayoutTests
{
    [Fact]
    public void UnspecifiedLength_IsTakenFromTheSignalFile()
    {
        // header(5): "If it [number of samples] is zero or missing, the number of samples is unspecified". Seven
        // format-212 samples fill 11 bytes (the last pair cut short after its first sample, as WFDB writers do).
        using var folder = new TempFolder("wfdb-layout");
        int[] values = [1, -1, 2047, -2047, 0, 100, -100];
        folder.Write("rec.dat", WfdbHandEncoder.Encode(212, values));
        folder.Write("rec.hea", Encoding.ASCII.GetBytes("rec 1 100\nrec.dat 212 1(0) 12 0 1 0 0 x\n"));
        using var reader = WfdbRecordReader.Open(folder.Path("rec"));
        Assert.Equal(11, new FileInfo(folder.Path("rec.dat")).Length);
        Assert.Equal(7, reader.Info.Channels[0].SampleCount);
        Assert.Equal(0.07, reader.Info.DurationS, 12);
        var got = new float[7];
        reader.Read(0, 0, got);
        Assert.Equal(values.Select(v => (float)v), got);
    }

    [Fact]
    public void OneOfTwoSignalFilesAbsent_IsMetadataOnly()
    {
        using var folder = new TempFolder("wfdb-layout");
        folder.Write("a.dat", WfdbHandEncoder.Encode(16, [1, 2]));
        folder.Write("rec.hea", Encoding.ASCII.GetBytes("rec 2 100 2 10:00:00 01/02/2020\na.dat 16\nb.dat 16\n"));
        using var reader = WfdbRecordReader.Open(folder.Path("rec.hea"));
        Assert.False(reader.Info.HasSignal);
        Assert.Equal("no signal file (b.dat)", reader.Info.NoSignalReason);
        Assert.Equal(new DateOnly(2020, 2, 1), reader.Info.StartDate);
        Assert.Equal(0.02, reader.Info.DurationS, 12);
        Assert.Equal("WFDB (format 16)", reader.Info.FormatDetail);
    }

    [Fact]
    public void MixedFormats_AreListedInFormatDetail()
    {
        using var folder = new TempFolder("wfdb-layout");
        folder.Write("a.dat", WfdbHandEncoder.Encode(212, [5, 6]));
        folder.Write("b.dat", WfdbHandEncoder.Encode(16, [7]));
        folder.Write("rec.hea", Encoding.ASCII.GetBytes("rec 3 100 1\na.dat 212\na.dat 212\nb.dat 16\n"));
        using var reader = WfdbRecordReader.Open(folder.Path("rec.hea"));
        Assert.Equal("WFDB (formats 16, 212)", reader.Info.FormatDetail);
        var got = new float[3];
        reader.Read([2, 0, 1], 0, 1, got);

        // Gain absent: header(5) assumes 200 units per mV; baseline = ADC zero = 0.
        Assert.Equal([7 / 200f, 5 / 200f, 6 / 200f], got);
    }

    [Fact]
    public void Format8_ReadOutOfOrder_MatchesTheValuesWritten()
    {
        // signal(5) format 8: each byte is the difference from the signal's previous sample. Reads jump back and forth
        // so the reader must re-sum from the start or continue from where it stopped.
        const int frames = 20000;
        var rng = new Random(8);
        var stream = new int[2 * frames];
        stream[0] = 500;
        stream[1] = -500;
        for (var i = 2; i < stream.Length; i++)
        {
            stream[i] = stream[i - 2] + rng.Next(-100, 101);
        }

        using var folder = new TempFolder("wfdb-layout");
        folder.Write("rec.dat", WfdbHandEncoder.Encode(8, stream, [0, 1], [500, -500]));
        folder.Write("rec.hea", Encoding.ASCII.GetBytes($"rec 2 100 {frames}\nrec.dat 8 1(0) 10 0 500 0 0 a\nrec.dat 8 1(0) 10 0 -500 0 0 b\n"));
        using var reader = WfdbRecordReader.Open(folder.Path("rec.hea"));
        foreach (var (start, count) in new[] { (15000, 3000), (10, 200), (19990, 10), (0, 1), (150000 / 10, 4999), (7, 19993) })
        {
            var got = new float[2 * count];
            reader.Read([0, 1], start, count, got);
            for (var i = 0; i < count; i++)
            {
                Assert.Equal(stream[2 * (start + i)], got[i]);
                Assert.Equal(stream[2 * (start + i) + 1], got[count + i]);
            }
        }
    }
}
