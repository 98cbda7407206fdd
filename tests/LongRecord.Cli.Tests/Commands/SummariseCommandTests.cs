using System.Security.Cryptography;
using LongRecord.Formats.Wfdb;
using LongRecord.Pipeline.Inputs;
using LongRecord.TestSupport;

namespace LongRecord.Cli.Tests.Commands;

/// <summary>The output contract of <c>summarise</c> (beats issue, "Output" and "Re-analysis from existing beats").</summary>
public sealed class SummariseCommandTests
{
    [Fact]
    public void Mitdb100_WritesBeatsCsvAnnotationsAndQuality_WithTheContractColumns()
    {
        using var folder = new TempFolder("summarise");
        var hea = Path.Combine(SharedData.Physionet("mitdb"), "100.hea");
        var before = Hash(Path.Combine(SharedData.Physionet("mitdb"), "100.dat"));
        var (code, stdout, stderr) = Run("summarise", hea, "--out", folder.FullPath);
        Assert.Equal(0, code);
        Assert.Equal("", stderr);
        Assert.Contains("100.hea:", stdout);

        var dir = Path.Combine(folder.FullPath, "100");
        var lines = File.ReadAllLines(Path.Combine(dir, "beats.csv"));
        Assert.Equal("sample,time_s,class,qrs_on,qrs_off,qrs_ms,p_wave,lead_quality", lines[0]);
        var rows = lines.Skip(1).Select(l => l.Split(',')).ToArray();
        Assert.All(rows, r => Assert.Equal(8, r.Length));
        Assert.All(rows, r => Assert.Contains(r[2], new[] { "N", "S", "V", "F", "Q" }));
        Assert.All(rows, r => Assert.Contains(r[7], new[] { "good", "noisy", "single-lead" }));
        // time_s = sample / f_ref (360 Hz, MITDB directory).
        Assert.All(rows, r => Assert.Equal(long.Parse(r[0]) / 360.0, double.Parse(r[1], System.Globalization.CultureInfo.InvariantCulture), 3));
        // Source: MIT-BIH directory, record 100 has 2 273 beats; the detector finds them within a handful.
        Assert.InRange(rows.Length, 2273 - 10, 2273 + 10);

        var annotations = WfdbAnnotationReader.Read(Path.Combine(dir, "100.beats"));
        Assert.Equal(rows.Select(r => long.Parse(r[0])), annotations.Select(a => a.Sample));
        Assert.Equal(rows.Select(r => r[2]), annotations.Select(a => a.Mnemonic));

        var quality = File.ReadAllLines(Path.Combine(dir, "quality.csv"));
        Assert.Equal("start_s,end_s,analysable,reason", quality[0]);
        Assert.Equal(0.0, double.Parse(quality[1].Split(',')[0], System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal(650000 / 360.0, double.Parse(quality[^1].Split(',')[1], System.Globalization.CultureInfo.InvariantCulture), 0);

        Assert.Equal(before, Hash(Path.Combine(SharedData.Physionet("mitdb"), "100.dat")));
        Assert.Empty(Directory.GetDirectories(folder.FullPath, ".*"));
    }

    [Fact]
    public void TwoInputsOfOneName_EachGetsAHashSuffixFromItsRelativePath()
    {
        using var input = new TempFolder("names");
        using var output = new TempFolder("names-out");
        Run("synth", "sinus-rest", "--out", input.Path("a/rec.edf"), "--hours", "0.02");
        Run("synth", "sinus-rest", "--out", input.Path("b/rec.edf"), "--hours", "0.02");
        var (code, _, stderr) = Run("summarise", input.FullPath, "--out", output.FullPath);
        Assert.True(code == 0, stderr);
        var names = Directory.GetDirectories(output.FullPath).Select(Path.GetFileName).Order().ToArray();
        Assert.Equal(new[] { $"rec-{RecordingDiscovery.ShortHash("a/rec.edf")}", $"rec-{RecordingDiscovery.ShortHash("b/rec.edf")}" }.Order(), names);
    }

    [Fact]
    public void BrokenRecording_OneErrorLine_NoFolder_OthersWritten_ExitThree()
    {
        using var input = new TempFolder("broken");
        using var output = new TempFolder("broken-out");
        Run("synth", "sinus-rest", "--out", input.Path("good.edf"), "--hours", "0.02");
        var bytes = File.ReadAllBytes(input.Path("good.edf"));
        File.WriteAllBytes(input.Path("cut.edf"), bytes[..(bytes.Length / 2)]);
        var (code, _, stderr) = Run("summarise", input.Path("good.edf"), input.Path("cut.edf"), "--out", output.FullPath);
        Assert.Equal(3, code);
        var err = stderr.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Single(err);
        // Logs name recordings relative to their input root (batch issue, "no patient identifiers in logs").
        Assert.StartsWith("cut.edf: ", err[0]);
        Assert.Equal(new[] { "good" }, Directory.GetDirectories(output.FullPath).Select(Path.GetFileName));
    }

    [Fact]
    public void Ltafdb_HeaderWithoutSignal_NeedsBeats_ThenAnalysedFromQrsAlone()
    {
        using var output = new TempFolder("ltafdb");
        var hea = Path.Combine(SharedData.Physionet("ltafdb"), "00.hea");
        var (code, _, stderr) = Run("summarise", hea, "--out", output.FullPath);
        Assert.Equal(2, code);
        Assert.Contains("no signal file", stderr);
        Assert.Empty(Directory.GetDirectories(output.FullPath));

        (code, var stdout, stderr) = Run("summarise", hea, "--beats", "qrs", "--out", output.FullPath);
        Assert.True(code == 0, stderr);
        Assert.Contains("from annotations only, no signal", stdout);
        var rows = File.ReadAllLines(Path.Combine(output.FullPath, "00", "beats.csv")).Skip(1).Select(l => l.Split(',')).ToArray();
        // Every beat of the .qrs file (EC57 beat codes only), no widths, no P-wave judgement.
        var expected = WfdbAnnotationReader.Read(Path.Combine(SharedData.Physionet("ltafdb"), "00.qrs")).Where(a => a.IsBeat).Select(a => a.Sample).ToArray();
        Assert.Equal(expected, rows.Select(r => long.Parse(r[0])));
        Assert.All(rows, r => Assert.Equal("", r[5]));
        Assert.All(rows, r => Assert.Equal("", r[6]));
        // Unlabelled beats get RR-rule classes: mostly N, not all Q.
        Assert.True(rows.Count(r => r[2] == "N") > rows.Length / 2);
    }

    [Fact]
    public void BeatsFromCsvOfTimes_OnASignal_AreTakenAsGiven()
    {
        using var input = new TempFolder("csvbeats");
        using var output = new TempFolder("csvbeats-out");
        Run("synth", "sinus-rest", "--out", input.Path("rec.edf"), "--hours", "0.02");
        File.WriteAllText(input.Path("times.csv"), "time_s\n1.0\n2.0\n3.5\n10.25\n");
        var (code, _, stderr) = Run("summarise", input.Path("rec.edf"), "--beats", input.Path("times.csv"), "--out", output.FullPath);
        Assert.True(code == 0, stderr);
        var rows = File.ReadAllLines(Path.Combine(output.FullPath, "rec", "beats.csv")).Skip(1).Select(l => l.Split(',')).ToArray();
        Assert.Equal(new long[] { 250, 500, 875, 2563 }, rows.Select(r => long.Parse(r[0])));
    }

    private static string Hash(string path) => Convert.ToHexString(SHA256.HashData(File.ReadAllBytes(path)));

    private static (int Code, string Stdout, string Stderr) Run(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        return (Program.Run(args, o, e), o.ToString(), e.ToString());
    }
}
