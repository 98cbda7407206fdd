using LongRecord.TestSupport;

namespace LongRecord.Cli.Tests.Commands;

public sealed class InspectCommandTests
{
    [Fact]
    public void Mitdb100_DescribesTwoLeadsAt360Hz()
    {
        // Source: MIT-BIH Arrhythmia Database directory, record 100: MLII and V5, 360 Hz, 650 000 samples.
        var hea = Path.Combine(SharedData.Physionet("mitdb"), "100.hea");
        var (code, stdout, stderr) = Run("inspect", hea);
        Assert.Equal(0, code);
        Assert.Equal("", stderr);
        Assert.Contains("WFDB (format 212)", stdout);
        Assert.Matches(@"0\s+MLII\s+\S*\s+360\s+650000", stdout);
        Assert.Matches(@"1\s+V5\s+\S*\s+360\s+650000", stdout);
        Assert.Contains("not recorded: times are elapsed", stdout);
    }

    [Fact]
    public void LtafdbHeaderWithoutSignal_SaysNoSignalFile()
    {
        // LTAFDB ships headers and annotations only (physionet/ltafdb/README.md).
        var (code, stdout, _) = Run("inspect", "--no-survey", Path.Combine(SharedData.Physionet("ltafdb"), "00.hea"));
        Assert.Equal(0, code);
        Assert.Contains("no signal file", stdout);
    }

    [Fact]
    public void BadFile_OneLineErrorNamingIt_ExitTwo_OthersStillDescribed()
    {
        using var folder = new TempFolder("inspect");
        var bad = folder.Write("broken.edf", "0       garbage"u8.ToArray());
        var hea = Path.Combine(SharedData.Physionet("mitdb"), "101.hea");
        var (code, stdout, stderr) = Run("inspect", "--no-survey", bad, hea);
        Assert.Equal(2, code);
        var lines = stderr.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Single(lines);
        Assert.StartsWith(bad + ": ", lines[0]);
        Assert.Contains("101.hea", stdout);
    }

    [Fact]
    public void UnknownOption_IsUsageError()
    {
        var (code, _, _) = Run("inspect", "--frobnicate", "x");
        Assert.Equal(1, code);
    }

    private static (int Code, string Stdout, string Stderr) Run(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        var code = Program.Run(args, o, e);
        return (code, o.ToString(), e.ToString());
    }
}
