using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>MIT annotation format (annotation(5)): write then read gives the same annotations; bytes as specified.</summary>
public class WfdbAnnotationRoundTripTests
{
    [Theory]
    [InlineData("mitdb", "100.atr")]
    [InlineData("mitdb", "207.atr")]
    [InlineData("ltafdb", "00.atr")]
    [InlineData("qtdb", "sel100.q1c")]
    public void ReferenceFile_WriteThenRead_GivesSameAnnotations(string database, string file)
    {
        // mitdb 100.atr has AUX rhythm text; ltafdb 00.atr starts with a SKIP and carries (AFIB; qtdb .q1c uses NUM.
        var original = WfdbAnnotationReader.Read(Path.Combine(SharedData.Physionet(database), file));
        using var folder = new TempFolder("wfdb-ann");
        var copy = folder.Path(file);
        WfdbAnnotationWriter.Write(copy, original);
        Assert.Equal(original, WfdbAnnotationReader.Read(copy));
    }

    [Fact]
    public void Ltafdb00_RewriteIsByteIdentical()
    {
        // ltafdb 00.atr (AUX text without NUL, SKIP, NUM): our choice of when to write SKIP, NUM and AUX words
        // reproduces PhysioNet's file byte for byte.
        var path = Path.Combine(SharedData.Physionet("ltafdb"), "00.atr");
        using var folder = new TempFolder("wfdb-ann");
        WfdbAnnotationWriter.Write(folder.Path("00.atr"), WfdbAnnotationReader.Read(path));
        Assert.True(File.ReadAllBytes(path).AsSpan().SequenceEqual(File.ReadAllBytes(folder.Path("00.atr"))));
    }

    [Fact]
    public void HandBuiltList_ExercisingEveryWord_RoundTrips()
    {
        var list = HandBuilt();
        using var folder = new TempFolder("wfdb-ann");
        WfdbAnnotationWriter.Write(folder.Path("x.atr"), list);
        Assert.Equal(list, WfdbAnnotationReader.Read(folder.Path("x.atr")));
        Assert.Empty(Directory.GetFiles(folder.FullPath, "*.tmp"));
    }

    [Fact]
    public void SmallList_BytesAsAnnotationFormatSpecifies()
    {
        // annotation(5), worked by hand: word = code << 10 | field, low byte first.
        // N (1) at 18: 0x0412. SKIP to 2018: 59 << 10 = 0xEC00, interval 2000 = 0x000007D0 high word first, then
        // V (5) with field 0: 0x1400, SUB 3 (61): 0xF403, CHN 2 (62): 0xF802, NUM 7 (60): 0xF007,
        // AUX "(VT" (63, 3 bytes): 0xFC03 '(' 'V' 'T' pad 0. End: 0x0000.
        var list = new[]
        {
            new WfdbAnnotation(18, WfdbAnnotationCode.Normal),
            new WfdbAnnotation(2018, WfdbAnnotationCode.PrematureVentricular, Subtype: 3, Channel: 2, Number: 7, Aux: "(VT"),
        };
        byte[] expected = [0x12, 0x04, 0x00, 0xEC, 0x00, 0x00, 0xD0, 0x07, 0x00, 0x14, 0x03, 0xF4, 0x02, 0xF8, 0x07, 0xF0, 0x03, 0xFC, 0x28, 0x56, 0x54, 0x00, 0x00, 0x00];
        using var folder = new TempFolder("wfdb-ann");
        WfdbAnnotationWriter.Write(folder.Path("x.atr"), list);
        Assert.Equal(expected, File.ReadAllBytes(folder.Path("x.atr")));
    }

    [Fact]
    public void HandBuiltList_BiosigReadsWhatWeWrite()
    {
        // BioSig's save2gdf reads MIT annotation files beside a record and lists them in its ASCII event table as
        // "0x<code>  <(sample − 1) / fs>" (observed on mitdb 100.atr: the rhythm change at sample 18 prints 0.047222).
        const string tool = "/usr/bin/save2gdf";
        Assert.True(File.Exists(tool), $"{tool} not found: install biosig-tools (apt-get install biosig-tools)");
        const int fs = 100;
        var list = HandBuilt().Where(a => a.Sample is >= 1 and < 200000).ToList();
        using var folder = new TempFolder("wfdb-ann-biosig");
        folder.Write("rec.dat", new byte[2 * 200000]);
        folder.Write("rec.hea", System.Text.Encoding.ASCII.GetBytes($"rec 1 {fs} 200000\nrec.dat 16 200 16 0 0 0 0 ECG\n"));
        WfdbAnnotationWriter.Write(folder.Path("rec.atr"), list);
        var start = new System.Diagnostics.ProcessStartInfo(tool) { RedirectStandardOutput = true, RedirectStandardError = true };
        start.ArgumentList.Add("-f=ASCII");
        start.ArgumentList.Add(folder.Path("rec.hea"));
        start.ArgumentList.Add(folder.Path("out"));
        using (var p = System.Diagnostics.Process.Start(start)!)
        {
            p.StandardOutput.ReadToEnd();
            p.StandardError.ReadToEnd();
            Assert.True(p.WaitForExit(60_000));
        }

        var events = File.ReadAllLines(folder.Path("out")).Where(l => l.StartsWith("0x", StringComparison.Ordinal))
            .Select(l => l.Split('\t', StringSplitOptions.RemoveEmptyEntries))
            .Select(f => (Code: Convert.ToInt32(f[0], 16), Sample: (long)Math.Round(double.Parse(f[1], System.Globalization.CultureInfo.InvariantCulture) * fs) + 1))
            .ToList();
        Assert.Equal(list.Select(a => ((int)a.Code, a.Sample)), events.Select(e => (e.Code, e.Sample)));
    }

    [Theory]
    [InlineData(0, null)]
    [InlineData(59, null)]
    [InlineData(1, "bad\0text")]
    [InlineData(1, "\u0100")]
    public void UnwritableAnnotation_ThrowsAndLeavesNoFile(int code, string? aux)
    {
        // annotation(5): code 0 with time 0 ends the file and 59–63 are the format's own words; AUX is a byte string.
        using var folder = new TempFolder("wfdb-ann");
        var list = new[] { new WfdbAnnotation(10, WfdbAnnotationCode.Normal), new WfdbAnnotation(20, (WfdbAnnotationCode)code, Aux: aux) };
        Assert.Throws<ArgumentException>(() => WfdbAnnotationWriter.Write(folder.Path("x.atr"), list));
        Assert.Empty(Directory.GetFiles(folder.FullPath));
    }

    /// <summary>Gaps above 1023 and above 65535 (SKIP), NUM, SUB (also negative), CHN, AUX of odd, even and zero length.</summary>
    private static List<WfdbAnnotation> HandBuilt() =>
    [
        new(0, WfdbAnnotationCode.RhythmChange, Aux: "(N"),
        new(5, WfdbAnnotationCode.Normal),
        new(5, WfdbAnnotationCode.Normal, Number: 3),
        new(1028, WfdbAnnotationCode.AtrialPremature),
        new(2052, WfdbAnnotationCode.PrematureVentricular, Subtype: -2, Channel: 1),
        new(2052 + 70000, WfdbAnnotationCode.RhythmChange, Channel: 1, Aux: "(AFIB"),
        new(2052 + 70000 + 1023, WfdbAnnotationCode.Normal, Number: 200, Channel: 255),
        new(100000, WfdbAnnotationCode.Comment, Subtype: 127, Aux: ""),
        new(100001, WfdbAnnotationCode.Comment, Aux: new string('z', 255)),
        new(100002, WfdbAnnotationCode.WaveformOnset, Number: 1),
        new(100002, WfdbAnnotationCode.WaveformEnd, Number: 1, Subtype: 1),
        new(150000, (WfdbAnnotationCode)45, Aux: "odd"),
        new(5_000_000_000, WfdbAnnotationCode.Normal),
    ];
}
