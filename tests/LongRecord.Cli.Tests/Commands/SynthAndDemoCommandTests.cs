using LongRecord.Formats;
using LongRecord.TestSupport;

namespace LongRecord.Cli.Tests.Commands;

public sealed class SynthAndDemoCommandTests
{
    [Fact]
    public void Synth_BuiltInScenario_WritesEdfAtrAndTruth_OfTheAskedLength()
    {
        using var folder = new TempFolder("synth");
        var edf = folder.Path("psvt.edf");
        var (code, stdout, stderr) = Run("synth", "psvt-180", "--out", edf, "--hours", "0.05", "--seed", "3", "--rate", "360");
        Assert.Equal(0, code);
        Assert.Equal("", stderr);
        Assert.Equal(edf, stdout.Trim());
        Assert.True(File.Exists(folder.Path("psvt.atr")));
        Assert.True(File.Exists(folder.Path("psvt.truth.json")));
        using var r = RecordingOpener.Open(edf);
        Assert.Equal(360, r.Info.Channels[0].SamplingRateHz);
        Assert.Equal(0.05 * 3600, r.Info.DurationS, 6);
    }

    [Fact]
    public void Synth_UnknownScenario_OneLineError_ExitTwo_NoOutput()
    {
        using var folder = new TempFolder("synth");
        var (code, _, stderr) = Run("synth", "no-such-scenario", "--out", folder.Path("x.edf"));
        Assert.Equal(2, code);
        Assert.Single(stderr.Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.Contains("no-such-scenario", stderr);
        Assert.Empty(Directory.GetFiles(folder.FullPath));
    }

    [Fact]
    public void Synth_BrokenScenarioFile_ListsItsProblems_ExitTwo()
    {
        using var folder = new TempFolder("synth");
        var json = folder.Write("bad.json", """{"name":"x","startDateTime":"2026-01-01T00:00","segments":[{"rhythm":"psvt","durationS":10,"rateBpm":300}]}"""u8.ToArray());
        var (code, _, stderr) = Run("synth", json, "--out", folder.Path("x.edf"));
        Assert.Equal(2, code);
        Assert.Contains("rateBpm", stderr);
        Assert.False(File.Exists(folder.Path("x.edf")));
    }

    [Fact]
    public void Demo_WritesTheInventedPatientsRecordingAndDescribesIt()
    {
        using var folder = new TempFolder("demo");
        var (code, stdout, stderr) = Run("demo", "--out", folder.FullPath, "--hours", "0.1");
        Assert.Equal(0, code);
        Assert.Equal("", stderr);
        Assert.Contains("EDF+C", stdout);
        Assert.Contains("ECG1", stdout);
        Assert.Contains("ECG2", stdout);
        Assert.True(File.Exists(Path.Combine(folder.FullPath, "demo-patient.edf")));
    }

    private static (int Code, string Stdout, string Stderr) Run(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        return (Program.Run(args, o, e), o.ToString(), e.ToString());
    }
}
