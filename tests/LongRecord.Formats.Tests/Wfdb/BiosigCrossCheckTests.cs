using System.Diagnostics;
using System.Globalization;
using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>
/// An independent reader: BioSig's <c>save2gdf</c> (Debian package biosig-tools) converts mitdb record 100 to its
/// ASCII format, one text file per channel (<c>out.a01</c>, <c>out.a02</c>) holding physical values in mV, one per
/// line. It prints with up to six significant digits; record 100's values are multiples of 1/200 mV, printed exactly
/// with at most three decimals. (BioSig scales by the ADC zero, not the baseline field, so it is no reference for
/// nstdb, whose headers give a different baseline; in record 100 the two are equal.)
/// </summary>
public class BiosigCrossCheckTests
{
    private const string Tool = "/usr/bin/save2gdf";

    [Fact]
    public void Mitdb100_AllSamplesEqualBiosigAscii()
    {
        Assert.True(File.Exists(Tool), $"{Tool} not found: install biosig-tools (apt-get install biosig-tools)");
        var header = Path.Combine(SharedData.Physionet("mitdb"), "100.hea");
        using var folder = new TempFolder("wfdb-biosig");
        var output = folder.Path("out");
        var start = new ProcessStartInfo(Tool) { RedirectStandardOutput = true, RedirectStandardError = true };
        start.ArgumentList.Add("-f=ASCII");
        start.ArgumentList.Add(header);
        start.ArgumentList.Add(output);
        using (var process = Process.Start(start)!)
        {
            process.StandardOutput.ReadToEnd();
            process.StandardError.ReadToEnd();
            Assert.True(process.WaitForExit(60_000), "save2gdf did not finish within 60 s");
            Assert.Equal(0, process.ExitCode);
        }

        using var reader = WfdbRecordReader.Open(header);
        var n = (int)reader.Info.Channels[0].SampleCount;
        var ours = new float[2 * n];
        reader.Read([0, 1], 0, n, ours);
        for (var c = 0; c < 2; c++)
        {
            var lines = File.ReadAllLines($"{output}.a0{c + 1}");
            Assert.Equal(n, lines.Length);
            for (var i = 0; i < n; i++)
            {
                // Half of the last printed digit (0.0005 mV), the precision BioSig prints.
                var theirs = double.Parse(lines[i], CultureInfo.InvariantCulture);
                Assert.True(Math.Abs(theirs - ours[c * n + i]) <= 0.0005, $"channel {c} sample {i}: BioSig {theirs}, ours {ours[c * n + i]}");
            }
        }
    }
}
