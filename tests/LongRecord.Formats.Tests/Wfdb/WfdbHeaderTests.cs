using LongRecord.Formats.Wfdb;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>Header parsing against the WFDB Applications Guide, header(5), and its examples.</summary>
public class WfdbHeaderTests
{
    [Fact]
    public void Example1_Record100_WithDefaultsShown()
    {
        // header(5) example 1, with CRLF line ends as the mitdb .hea files have them.
        var h = WfdbHeader.ParseText(
            "100 2 360 650000 0:0:0 0/0/0\r\n100.dat 212 200 11 1024 995 -22131 0 MLII\r\n100.dat 212 200 11 1024 1011 20052 0 V5\r\n# 69 M 1085 1629 x1\r\n# Aldomet, Inderal\r\n",
            "100.hea");
        Assert.Equal(("100", 2, 360.0, 650000L), (h.RecordName, h.SignalCount, h.SamplingFrequencyHz, h.SamplesPerSignal!.Value));
        Assert.Equal(new TimeOnly(0, 0), h.BaseTime);
        Assert.Null(h.BaseDate);
        var s = h.Signals[0];
        Assert.Equal(("100.dat", 212, 200.0, 11, 1024, 995, -22131, 0, "MLII"), (s.FileName, s.Format, s.AdcGain, s.AdcResolution, s.AdcZero, s.InitialValue!.Value, s.Checksum!.Value, s.BlockSize, s.Description));
        Assert.Null(s.Baseline);
        Assert.Equal(1024, s.EffectiveBaseline);
        Assert.Null(s.Units);
        Assert.Equal(["69 M 1085 1629 x1", "Aldomet, Inderal"], h.InfoStrings);
    }

    [Fact]
    public void Example2_DifferenceFormatWithAbsolutePaths()
    {
        // header(5) example 2 (AHA DB record 7001): format 8, one absolute-path file per signal, multi-word description.
        var h = WfdbHeader.ParseText("7001 2 250 525000\n/db1/data0/d0.7001 8 100 10 0 -53 -1279 0 ECG signal 0\n/db1/data1/d1.7001 8 100 10 0 -69 15626 0 ECG signal 1\n", "7001.hea");
        Assert.Equal("/db1/data1/d1.7001", h.Signals[1].FileName);
        Assert.Equal("ECG signal 1", h.Signals[1].Description);
        Assert.Equal(-69, h.Signals[1].EffectiveInitialValue);
    }

    [Fact]
    public void Example3_OnlyFileAndFormat_TakesDefaults()
    {
        // header(5) example 3: "data0 8"; no frequency (250 assumed), gain absent (200 assumed), units absent (mV).
        var h = WfdbHeader.ParseText("8l 2\ndata0 8\ndata1 8\n", "8l.hea");
        Assert.Equal(WfdbHeader.DefaultSamplingFrequencyHz, h.SamplingFrequencyHz);
        Assert.Null(h.SamplesPerSignal);
        Assert.Equal((0.0, 200.0, 0, (int?)null, (string?)null), (h.Signals[0].AdcGain, h.Signals[0].EffectiveGain, h.Signals[0].AdcZero, h.Signals[0].InitialValue, h.Signals[0].Description));
    }

    [Fact]
    public void FormatModifiers_GainBaselineUnits_CounterFrequency()
    {
        // header(5): format x samples-per-frame : skew + byte offset; gain (baseline) / units; frequency/counter(base).
        var h = WfdbHeader.ParseText("r 1 360/720(12.5) 1000 13:5:0.25 25/4/1989\nr.dat 16x4:2+512 166.945(-3)/uV 16 7 9 0 4096  lead  II  \n", "r.hea");
        Assert.Equal((360.0, 720.0, 12.5), (h.SamplingFrequencyHz, h.CounterFrequencyHz!.Value, h.BaseCounterValue));
        Assert.Equal(new TimeOnly(13, 5, 0, 250), h.BaseTime);
        Assert.Equal(new DateOnly(1989, 4, 25), h.BaseDate);
        var s = h.Signals[0];
        Assert.Equal((4, 2, 512L, 166.945, -3, "uV", 4096, "lead  II"), (s.SamplesPerFrame, s.Skew, s.ByteOffset, s.AdcGain, s.Baseline!.Value, s.Units, s.BlockSize, s.Description));
    }

    [Fact]
    public void ZeroSignals_CommentsBeforeAndBetween()
    {
        // nsr2db headers: "nsr001 0 128 0" (zero signals, zero samples = unspecified) and an info string.
        var h = WfdbHeader.ParseText("# before\n\nnsr001 0 128 0\n# <age>: 62 <sex>: M\n", "nsr001.hea");
        Assert.Equal((0, 128.0, (long?)null), (h.SignalCount, h.SamplingFrequencyHz, h.SamplesPerSignal));
        Assert.Empty(h.Signals);
        Assert.Equal(["before", "<age>: 62 <sex>: M"], h.Comments);
        Assert.Equal(["<age>: 62 <sex>: M"], h.InfoStrings);
    }

    [Fact]
    public void ExtraSignalLines_AreNotRead()
    {
        // header(5): "Any extra signal specification lines are not read by WFDB library functions."
        var h = WfdbHeader.ParseText("r 1 100 10\nr.dat 16\nother.dat 16\n", "r.hea");
        Assert.Single(h.Signals);
    }

    [Theory]
    [InlineData("r 1 0 10\nr.dat 16\n", "record line: sampling frequency must be greater than zero ('0')", 4)]
    [InlineData("r 1 360/x 10\nr.dat 16\n", "record line: counter frequency is not a number ('x')", 8)]
    [InlineData("r 1 360 1e3\nr.dat 16\n", "record line: number of samples per signal is not a non-negative integer ('1e3')", 8)]
    [InlineData("r 1 360 10 25:00:00\nr.dat 16\n", "record line: base time is not HH:MM:SS ('25:00:00')", 11)]
    [InlineData("r 1 360 10 1:2:3 1/1/2000 extra\nr.dat 16\n", "record line: unexpected field 'extra' after the base date", 26)]
    [InlineData("r 1\n", "record line: number of signals is 1 but the header has 0 signal specification lines", 2)]
    [InlineData("r 1\nr.dat\n", "header line 2: signal format is missing", 9)]
    [InlineData("r 1\nr.dat 16x0\n", "header line 2: samples per frame must be at least 1 ('16x0')", 14)]
    [InlineData("r 1\nr.dat 16q\n", "header line 2: unexpected 'q' after the signal format ('16q')", 12)]
    [InlineData("r 1\nr.dat 16 200 -1\n", "header line 2: ADC resolution must not be negative ('-1')", 17)]
    [InlineData("r 1\nr.dat 16 200 12 z\n", "header line 2: ADC zero is not an integer ('z')", 20)]
    [InlineData("r 1\nr.dat 16 200/\n", "header line 2: units are empty after '/' ('200/')", 16)]
    [InlineData("r 1\r\n# c\r\nr.dat 16 200 12 0 0 x\r\n", "header line 3: checksum is not an integer ('x')", 30)]
    public void InvalidField_NamesLineFieldAndByte(string text, string problem, long offset)
    {
        var e = Assert.Throws<RecordingFormatException>(() => WfdbHeader.ParseText(text, "r.hea"));
        Assert.Equal(problem, e.Problem);
        Assert.Equal(offset, e.ByteOffset);
        Assert.Equal($"r.hea: {problem} at byte {offset}", e.Message);
    }

    [Fact]
    public void MissingHeaderFile_IsFormatErrorNamingPath()
    {
        var e = Assert.Throws<RecordingFormatException>(() => WfdbHeader.Parse("/nonexistent/folder/x.hea"));
        Assert.Equal("/nonexistent/folder/x.hea: file not found", e.Message);
    }
}
