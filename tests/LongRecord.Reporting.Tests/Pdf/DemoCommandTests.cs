using LongRecord.Reporting.Tests.Support;
using LongRecord.TestSupport;

namespace LongRecord.Reporting.Tests.Pdf;

public sealed class DemoCommandTests
{
    [Fact]
    public void Demo_RunsTheWholeJob_AndPrintsThePathOfAReportPdfinfoAccepts()
    {
        using var folder = new TempFolder("demo");
        var stdout = CommandLine.Check("demo", "--out", folder.FullPath, "--hours", "0.1");
        var last = stdout.TrimEnd().Split('\n')[^1];
        Assert.StartsWith("report ", last);
        var pdf = last["report ".Length..].Trim();
        Assert.True(File.Exists(pdf), pdf);
        Assert.Equal("report.pdf", Path.GetFileName(pdf));
        Assert.True(Poppler.Pages(pdf) >= 3);
        foreach (var export in new[] { "summary.json", "episodes.csv", "hourly.csv", "demo-patient.beats", "report.fhir.json" })
        {
            Assert.True(File.Exists(Path.Combine(Path.GetDirectoryName(pdf)!, export)), export);
        }
    }
}
