using System.Text;
using LongRecord.Formats.Csv;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Csv;

public class CsvWriterTests
{
    // Round trip within 1e-4 mV (the brief's bound; the writer's shortest float text actually reads back exactly in mV).
    [Theory]
    [InlineData(128.0)]
    [InlineData(250.0)]
    [InlineData(360.0)]
    [InlineData(500.0)]
    [InlineData(1000.0)]
    public void WriteThenRead_RateExact_ValuesWithin1e4Millivolt(double rateHz)
    {
        using var temp = new TempFolder("csv");
        var path = temp.Path("round.csv");
        const int n = 3000;
        var signal = new float[2 * n];
        var random = new Random(9);
        for (var i = 0; i < signal.Length; i++)
        {
            signal[i] = (float)(4 * (random.NextDouble() - 0.5));
        }

        var options = new CsvWriterOptions
        {
            Leads = [new CsvLead("II"), new CsvLead("V5", "uV")],
            SamplingRateHz = rateHz,
            Start = new DateTime(2026, 3, 4, 8, 15, 0),
            Comments = ["Brackenfield Cardiology Clinic, invented demo"],
        };
        using (var writer = CsvRecordingWriter.Create(path, options))
        {
            // Two uneven blocks, to exercise appending.
            writer.Write(Slice(signal, n, 0, 1000), 1000);
            writer.Write(Slice(signal, n, 1000, n - 1000), n - 1000);
            writer.Complete();
        }

        using var reader = CsvRecordingReader.Open(path);
        Assert.Equal(rateHz, reader.Info.Channels[0].SamplingRateHz);
        Assert.Equal(n, reader.Info.Channels[0].SampleCount);
        Assert.Equal(new DateOnly(2026, 3, 4), reader.Info.StartDate);
        Assert.Equal(new TimeOnly(8, 15, 0), reader.Info.StartTime);
        Assert.Equal(["Brackenfield Cardiology Clinic, invented demo"], reader.Info.Comments);
        var back = new float[2 * n];
        reader.Read([0, 1], 0, n, back);
        Assert.Equal(signal.AsSpan(0, n).ToArray(), back.AsSpan(0, n).ToArray());
        for (var i = 0; i < n; i++)
        {
            Assert.True(Math.Abs(back[n + i] - signal[n + i]) <= 1e-4, $"V5 sample {i}: {back[n + i]} vs {signal[n + i]}");
        }
    }

    // The text itself, against the format definition (README): header cells "Label (Unit)", exact decimal times.
    [Fact]
    public void Writer_Text_FollowsFormatDefinition()
    {
        using var temp = new TempFolder("csv");
        var path = temp.Path("text.csv");
        using (var writer = CsvRecordingWriter.Create(path, new CsvWriterOptions { Leads = [new CsvLead("II"), new CsvLead("V5", "uV")], SamplingRateHz = 250 }))
        {
            writer.Write([0.5f, 0.25f, float.NaN, 1.5f, -2f, 0.001f], 3);
            writer.Complete();
        }

        Assert.Equal("time_s,II (mV),V5 (uV)\n0.000,0.5,1500\n0.004,0.25,-2000\n0.008,NaN,1\n", File.ReadAllText(path, Encoding.UTF8));
    }

    [Fact]
    public void Writer_IsoTime_And128Hz_AreExact()
    {
        using var temp = new TempFolder("csv");
        var path = temp.Path("iso.csv");
        var options = new CsvWriterOptions
        {
            Leads = [new CsvLead("II")],
            SamplingRateHz = 128,
            TimeFormat = CsvTimeFormat.IsoDateTime,
            Start = new DateTime(2026, 3, 4, 23, 59, 59),
        };
        using (var writer = CsvRecordingWriter.Create(path, options))
        {
            writer.Write(new float[130], 130);
            writer.Complete();
        }

        var lines = File.ReadAllLines(path);
        Assert.Equal("time,II (mV)", lines[0]);
        Assert.Equal("2026-03-04T23:59:59.0000000,0", lines[1]);

        // 1/128 s = 0.0078125 s exactly; row 128 is one second later, past midnight.
        Assert.Equal("2026-03-04T23:59:59.0078125,0", lines[2]);
        Assert.Equal("2026-03-05T00:00:00.0000000,0", lines[129]);
        using var reader = CsvRecordingReader.Open(path);
        Assert.Equal(128.0, reader.Info.Channels[0].SamplingRateHz);
        Assert.Equal(new TimeOnly(23, 59, 59), reader.Info.StartTime);
    }

    [Fact]
    public void Writer_DisposedWithoutComplete_LeavesNothing()
    {
        using var temp = new TempFolder("csv");
        using (var writer = CsvRecordingWriter.Create(temp.Path("gone.csv"), new CsvWriterOptions { Leads = [new CsvLead("II")], SamplingRateHz = 250 }))
        {
            writer.Write([1f, 2f], 2);
        }

        Assert.Empty(Directory.GetFiles(temp.FullPath));
    }

    [Fact]
    public void Writer_LabelWithSeparator_IsRejected()
    {
        using var temp = new TempFolder("csv");
        Assert.Throws<ArgumentException>(() =>
            CsvRecordingWriter.Create(temp.Path("bad.csv"), new CsvWriterOptions { Leads = [new CsvLead("II,V5")], SamplingRateHz = 250 }));
        Assert.Empty(Directory.GetFiles(temp.FullPath));
    }

    private static float[] Slice(float[] twoLeads, int n, int start, int count)
    {
        var slice = new float[2 * count];
        Array.Copy(twoLeads, start, slice, 0, count);
        Array.Copy(twoLeads, n + start, slice, count, count);
        return slice;
    }
}
