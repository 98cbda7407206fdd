using LongRecord.Formats;

namespace LongRecord.Formats.Tests.Recording;

public class RecordingFormatExceptionTests
{
    [Fact]
    public void Message_IsOneLine_FileProblemAndByte()
    {
        var e = new RecordingFormatException("a/b.edf", "bad\nthing", 256, "number of signals");
        Assert.Equal("a/b.edf: bad thing at byte 256", e.Message);
        Assert.Equal("number of signals", e.Field);
        Assert.Equal(256, e.ByteOffset);
    }

    [Fact]
    public void Message_WithoutOffset_NamesFileAndProblem()
    {
        Assert.Equal("x.hea: no signal file", new RecordingFormatException("x.hea", "no signal file").Message);
    }

    [Theory]
    [InlineData("mV", 1.0)]
    [InlineData("", 1.0)]
    [InlineData("uV", 0.001)]
    [InlineData("µV", 0.001)]
    [InlineData("V", 1000.0)]
    public void VoltageUnits_ConvertToMillivolts(string unit, double expected) =>
        Assert.Equal(expected, VoltageUnits.MillivoltsPer(unit), 12);

    [Theory]
    [InlineData("degC")]
    [InlineData("%")]
    [InlineData("MV")]
    public void VoltageUnits_NonVoltage_IsNaN(string unit) => Assert.True(double.IsNaN(VoltageUnits.MillivoltsPer(unit)));
}
