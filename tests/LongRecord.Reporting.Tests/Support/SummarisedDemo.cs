using System.Text.Json;
using LongRecord.TestSupport;

namespace LongRecord.Reporting.Tests.Support;

/// <summary>
/// Three hours of the demo day (its first diary entry is at 8 700 s) (an invented patient with a name and ID in the EDF+ header, and diary events),
/// synthesised and summarised once through the command line for the PDF and FHIR checks.
/// </summary>
public sealed class SummarisedDemo : IDisposable
{
    public const string PatientName = "Elowen Marchetti-Brandt";
    public const string PatientId = "SLC-2026-0417";

    private readonly TempFolder _folder = new("report-demo");

    public SummarisedDemo()
    {
        Edf = _folder.Path("demo-patient.edf");
        CommandLine.Check("synth", "demo-24h", "--out", Edf, "--hours", "3");
        CommandLine.Check("summarise", Edf, "--out", _folder.Path("out"));
        Folder = _folder.Path(Path.Combine("out", "demo-patient"));
        Summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(Folder, "summary.json")));
    }

    public string Edf { get; }

    public string Folder { get; }

    public string Pdf => Path.Combine(Folder, "report.pdf");

    public string Fhir => Path.Combine(Folder, "report.fhir.json");

    public JsonDocument Summary { get; }

    public void Dispose()
    {
        Summary.Dispose();
        _folder.Dispose();
    }
}

/// <summary>The command line, run in process.</summary>
public static class CommandLine
{
    public static (int Code, string Stdout, string Stderr) Run(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        return (LongRecord.Cli.Program.Run(args, o, e), o.ToString(), e.ToString());
    }

    public static string Check(params string[] args)
    {
        var (code, stdout, stderr) = Run(args);
        Assert.True(code == 0, $"longrecord {string.Join(' ', args)} exited {code}: {stderr}");
        return stdout;
    }
}
