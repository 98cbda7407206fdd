using System.Text;
using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>Content-based recognition of a header: the record line's shape (header(5)), not the file name.</summary>
public class WfdbSniffTests
{
    [Fact]
    public void EveryPhysionetHeader_IsRecognised()
    {
        var headers = Directory.GetFiles(SharedData.Path("physionet"), "*.hea", SearchOption.AllDirectories);
        Assert.True(headers.Length > 200, $"{headers.Length} headers");
        foreach (var h in headers)
        {
            var head = File.ReadAllBytes(h).AsSpan(0, (int)Math.Min(512, new FileInfo(h).Length));
            Assert.True(WfdbRecordReader.SniffHeader(head, h), h);
        }
    }

    [Fact]
    public void EdfFileAndAnnotationFile_AreNotHeaders()
    {
        // eegmmidb S001R01.edf (an EDF+ file) and mitdb 100.atr (binary annotations).
        foreach (var path in new[] { Path.Combine(SharedData.Physionet("eegmmidb"), "S001R01.edf"), Path.Combine(SharedData.Physionet("mitdb"), "100.atr") })
        {
            var head = File.ReadAllBytes(path).AsSpan(0, 512);
            Assert.False(WfdbRecordReader.SniffHeader(head, path), path);
        }
    }

    [Theory]
    [InlineData("time_s,lead_I,lead_II\n0.000,0.1,0.2\n")]
    [InlineData("ISHNE1.0")]
    [InlineData("")]
    [InlineData("# only comments\n")]
    [InlineData("rec 2 360 650000\nrec.dat MLII\n")]
    [InlineData("rec two 360\n")]
    [InlineData("rec 2 fast\n")]
    [InlineData("a b c d e f g h i j\n")]
    public void OtherText_IsNotAHeader(string text) =>
        Assert.False(WfdbRecordReader.SniffHeader(Encoding.ASCII.GetBytes(text), "x.txt"));

    [Theory]
    [InlineData("nsr001 0 128 0\n")]
    [InlineData("# comment first\r\n100 2 360 650000\r\n100.dat 212 200 11 1024 995 -22131 0 MLII\r\n")]
    [InlineData("r 1 250/360(0) 10 9:30:00 31/01/2003\nr.dat 16x2:1+24 200\n")]
    [InlineData("r 2 360 650000\nr.d")]
    public void RecordLineShapes_AreHeaders(string text) =>
        Assert.True(WfdbRecordReader.SniffHeader(Encoding.ASCII.GetBytes(text), "no-extension"));
}
