using LongRecord.Formats.Csv;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Csv;

/// <summary>Reads hand-written CSV text (see the format definition in src/LongRecord.Formats/Csv/README.md).</summary>
public class CsvReaderTests
{
    // Rows are samples at a known rate, so the inferred rate must equal it exactly after snapping; times are written
    // with 6 decimals (1/360 s is then off by up to 0.5 µs per row) and, separately, with the fewest places that still
    // lie within 10 % of the interval.
    [Theory]
    [InlineData(128.0, "F6")]
    [InlineData(128.0, "F4")]
    [InlineData(250.0, "F3")]
    [InlineData(360.0, "F6")]
    [InlineData(360.0, "F5")]
    [InlineData(500.0, "F3")]
    [InlineData(1000.0, "F3")]
    public void Rate_InferredExactly_FromTimeColumn(double rateHz, string timeFormat)
    {
        using var temp = new TempFolder("csv");
        var path = temp.Write("rate.csv", CsvTestText.Bytes(CsvTestText.Seconds(rateHz, 2000, timeFormat: timeFormat)));
        using var reader = CsvRecordingReader.Open(path);
        Assert.Equal(rateHz, reader.Info.Channels[0].SamplingRateHz);
        Assert.Equal(2000, reader.Info.Channels[0].SampleCount);
        Assert.Equal(2000 / rateHz, reader.Info.DurationS, 9);
    }

    [Fact]
    public void Rate_FractionalRate_IsKept()
    {
        using var temp = new TempFolder("csv");
        var path = temp.Write("frac.csv", CsvTestText.Bytes(CsvTestText.Seconds(128.5, 3000, timeFormat: "F7")));
        using var reader = CsvRecordingReader.Open(path);
        Assert.Equal(128.5, reader.Info.Channels[0].SamplingRateHz);
    }

    [Fact]
    public void Values_MatchTheTextAsWritten()
    {
        using var temp = new TempFolder("csv");
        var path = temp.Write("values.csv", CsvTestText.Bytes(CsvTestText.Seconds(250, 3000, leads: 2, timeFormat: "F3")));
        using var reader = CsvRecordingReader.Open(path);
        var values = new float[2 * 3000];
        reader.Read([0, 1], 0, 3000, values);
        for (var k = 0; k < 2; k++)
        {
            for (var i = 0; i < 3000; i++)
            {
                Assert.Equal((float)CsvTestText.Value(k, i), values[k * 3000 + i]);
            }
        }

        Assert.Equal(["L1", "L2"], reader.Info.Channels.Select(c => c.Label));
        Assert.All(reader.Info.Channels, c => Assert.Equal("mV", c.PhysicalUnit));
        Assert.All(reader.Info.Channels, c => Assert.Equal(1e-4, c.Resolution, 12));
        Assert.Null(reader.Info.StartDate);
        Assert.Null(reader.Info.StartTime);
    }

    [Fact]
    public void IsoTime_GivesStartFromFirstRow_AndRate()
    {
        using var temp = new TempFolder("csv");
        var start = new DateTime(2026, 3, 4, 23, 59, 58, 500);
        var path = temp.Write("iso.csv", CsvTestText.Bytes(CsvTestText.Iso(start, 250, 1000)));
        using var reader = CsvRecordingReader.Open(path);
        Assert.Equal(new DateOnly(2026, 3, 4), reader.Info.StartDate);
        Assert.Equal(new TimeOnly(23, 59, 58, 500), reader.Info.StartTime);
        Assert.Equal(250.0, reader.Info.Channels[0].SamplingRateHz);
        Assert.Equal(4.0, reader.Info.DurationS, 12);
        var values = new float[1000];
        reader.Read(0, 0, values);
        Assert.Equal((float)CsvTestText.Value(0, 999), values[999]);
    }

    [Fact]
    public void IsoTime_WithSpaceInsteadOfT_IsAccepted()
    {
        using var temp = new TempFolder("csv");
        var text = "time,II\n2026-03-04 08:15:00.000,1\n2026-03-04 08:15:00.004,2\n2026-03-04 08:15:00.008,3\n";
        using var reader = CsvRecordingReader.Open(temp.Write("space.csv", CsvTestText.Bytes(text)));
        Assert.Equal(new TimeOnly(8, 15, 0), reader.Info.StartTime);
        Assert.Equal(250.0, reader.Info.Channels[0].SamplingRateHz);
    }

    // Units: VoltageUnits' factors (µV = 1e-3 mV, V = 1e3 mV); no unit means mV; a non-voltage unit is returned as written.
    [Fact]
    public void Units_InBracketsOrParentheses_AreConvertedToMillivolts()
    {
        using var temp = new TempFolder("csv");
        var text = "t,II,V5 [uV],aux (V),resp (%),V1 [µV]\n0,0.5,1000,0.002,40,-250\n0.002,0.25,-500,0.001,41,250\n";
        using var reader = CsvRecordingReader.Open(temp.Write("units.csv", CsvTestText.Bytes(text)));
        Assert.Equal(["II", "V5", "aux", "resp", "V1"], reader.Info.Channels.Select(c => c.Label));
        Assert.Equal(["mV", "uV", "V", "%", "µV"], reader.Info.Channels.Select(c => c.PhysicalUnit));
        Assert.False(reader.Info.Channels[3].IsVoltage);
        var values = new float[5 * 2];
        reader.Read([0, 1, 2, 3, 4], 0, 2, values);
        Assert.Equal([0.5f, 0.25f, 1.0f, -0.5f, 2.0f, 1.0f, 40f, 41f, -0.25f, 0.25f], values);
        Assert.Equal(500.0, reader.Info.Channels[0].SamplingRateHz);
    }

    [Fact]
    public void Comments_BeforeHeader_AndStartLine_AreRead()
    {
        using var temp = new TempFolder("csv");
        var prologue = "\uFEFF# Brackenfield Cardiology Clinic demo\n\n#  start: 2026-03-04T08:15:00\n# lead placement: CM5\n";
        var text = CsvTestText.Seconds(200, 400, timeFormat: "F3", prologue: prologue, time: i => 10 + i / 200.0).Replace("\n", "\r\n");
        using var reader = CsvRecordingReader.Open(temp.Write("comments.csv", CsvTestText.Bytes(text)));
        Assert.Equal(["Brackenfield Cardiology Clinic demo", "lead placement: CM5"], reader.Info.Comments);

        // "# start:" is the clock time of time 0; the first row is at 10 s.
        Assert.Equal(new DateOnly(2026, 3, 4), reader.Info.StartDate);
        Assert.Equal(new TimeOnly(8, 15, 10), reader.Info.StartTime);
        Assert.Equal(200.0, reader.Info.Channels[0].SamplingRateHz);
        var values = new float[400];
        reader.Read(1, 0, values);
        Assert.Equal((float)CsvTestText.Value(1, 399), values[399]);
    }

    [Theory]
    [InlineData(";")]
    [InlineData("\t")]
    [InlineData(", ")]
    public void Separators_SemicolonTabAndPaddedComma_AreAccepted(string separator)
    {
        using var temp = new TempFolder("csv");
        var path = temp.Write("sep.csv", CsvTestText.Bytes(CsvTestText.Seconds(250, 300, leads: 3, timeFormat: "F3", separator: separator)));
        using var reader = CsvRecordingReader.Open(path);
        Assert.Equal(3, reader.Info.Channels.Count);
        var values = new float[300];
        reader.Read(2, 0, values);
        Assert.Equal((float)CsvTestText.Value(2, 123), values[123]);
    }

    [Fact]
    public void NaNValue_ReadsAsNaN()
    {
        using var temp = new TempFolder("csv");
        var text = "time_s,II\n0.000,1\n0.004,NaN\n0.008,3\n";
        using var reader = CsvRecordingReader.Open(temp.Write("nan.csv", CsvTestText.Bytes(text)));
        var values = new float[3];
        reader.Read(0, 0, values);
        Assert.True(float.IsNaN(values[1]));
        Assert.Equal(3f, values[2]);
    }

    // 5 % jitter is inside the 10 % tolerance (common practice, no source) and must pass.
    [Fact]
    public void Jitter_WithinTolerance_IsAccepted()
    {
        using var temp = new TempFolder("csv");
        var text = CsvTestText.Seconds(250, 1000, time: i => i / 250.0 + (i % 2 == 1 ? 0.05 * 0.004 : 0));
        using var reader = CsvRecordingReader.Open(temp.Write("jitter-ok.csv", CsvTestText.Bytes(text)));
        Assert.Equal(250.0, reader.Info.Channels[0].SamplingRateHz);
    }

    // Last step 6 ms at 250 Hz: 50 % over the 4 ms interval, beyond 10 % plus the 1 ms rounding allowance of 3 decimals.
    // One displaced end point moves the fitted interval by far less than the snapping slack, so the rate stays 250 Hz.
    [Fact]
    public void Jitter_BeyondTolerance_IsRejectedNamingLineAndByte()
    {
        using var temp = new TempFolder("csv");
        var text = CsvTestText.Seconds(250, 400, timeFormat: "F3", time: i => i / 250.0 + (i == 399 ? 0.002 : 0));
        var path = temp.Write("jitter.csv", CsvTestText.Bytes(text));
        var e = Assert.Throws<RecordingFormatException>(() => CsvRecordingReader.Open(path));
        Assert.Equal(
            $"{path}: time step of 0.006 s at line 401 deviates from the sampling interval 0.004 s (250 Hz) by more than 10 % at byte {CsvTestText.OffsetOfLine(text, 401)}",
            e.Message);
    }

    [Fact]
    public void LineLongerThanLimit_IsRejected()
    {
        using var temp = new TempFolder("csv");
        var text = "time_s,II\n0,1\n0.004," + new string('1', 70_000) + "\n";
        var e = Assert.Throws<RecordingFormatException>(() => CsvRecordingReader.Open(temp.Write("long.csv", CsvTestText.Bytes(text))));
        Assert.Contains("line 3 is longer than 65536 bytes", e.Message);
        Assert.Equal(CsvTestText.OffsetOfLine(text, 3), e.ByteOffset);
    }

    [Fact]
    public void Sniff_HeaderWithTimeColumn_OrCsvExtension()
    {
        Assert.True(CsvRecordingReader.Sniff("# x\ntime_s,II (mV)\n0,1\n"u8, "a.txt"));
        Assert.True(CsvRecordingReader.Sniff("\uFEFFt;V5 [uV]\n"u8, "a.dat"));
        Assert.False(CsvRecordingReader.Sniff("name,II\n"u8, "a.txt"));
        Assert.True(CsvRecordingReader.Sniff("name,II\n"u8, "a.CSV"));
        Assert.False(CsvRecordingReader.Sniff("ISHNE1.0\0\0"u8, "a.csv"));
        Assert.False(CsvRecordingReader.Sniff("0 1 2\n"u8, "a.txt"));
    }

    [Fact]
    public void FormatDetail_NamesSeparatorAndTimeKind()
    {
        using var temp = new TempFolder("csv");
        using var reader = CsvRecordingReader.Open(temp.Write("d.csv", CsvTestText.Bytes("time;II\n0;1\n0.5;2\n")));
        Assert.Equal(RecordingFormat.Csv, reader.Info.Format);
        Assert.Equal("CSV (';'-separated, time in seconds)", reader.Info.FormatDetail);
        Assert.Equal(2.0, reader.Info.Channels[0].SamplingRateHz);
    }
}
