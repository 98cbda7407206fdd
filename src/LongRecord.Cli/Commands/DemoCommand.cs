using System.CommandLine;
using LongRecord.Formats;
using LongRecord.Pipeline;
using LongRecord.Pipeline.Inputs;
using LongRecord.Pipeline.Report;

namespace LongRecord.Cli.Commands;

/// <summary>
/// <c>longrecord demo [--out DIR]</c>: the whole job on the built-in 24 h two-lead demo day of an invented patient —
/// synthesise it, describe it, summarise it (beats, rhythm, report) — and print the path of its report.
/// </summary>
public static class DemoCommand
{
    public const string Scenario = "demo-24h";

    public static Command Create(TextWriter stdout, TextWriter stderr)
    {
        var output = new Option<DirectoryInfo>("--out", "-o") { Description = "Folder for the demo files (default: ./longrecord-demo)" };
        var hours = new Option<double?>("--hours") { Description = "Shorten or lengthen the demo day (hours; default 24)" };
        var cmd = new Command("demo", "Run the whole job on the built-in demo day of an invented patient and print the path of its PDF report") { output, hours };
        var report = new ReportCommandOptions();
        report.AddTo(cmd);
        cmd.SetAction(parse => CommandRunner.Run(stderr, () =>
        {
            var dir = parse.GetValue(output)?.ToString() ?? "longrecord-demo";
            return Run(dir, parse.GetValue(hours), stdout, report.Resolve(parse));
        }));
        return cmd;
    }

    public static ExitCode Run(string folder, double? hours, TextWriter stdout, ReportOptions? report = null)
    {
        var edf = Path.Combine(folder, "demo-patient.edf");
        stdout.WriteLine($"synthesising the demo day into {folder} …");
        var paths = SynthCommand.Run(Scenario, edf, hours, seed: null, rateHz: null);
        stdout.WriteLine($"recording  {paths.Edf}");
        stdout.WriteLine($"truth      {paths.Annotations} (WFDB annotations), {paths.Truth}");
        stdout.WriteLine();
        using (var reader = RecordingOpener.Open(paths.Edf))
        {
            InspectCommand.Describe(reader, survey: true, stdout);
        }

        stdout.WriteLine();
        stdout.WriteLine("analysing (beats, rhythm, report) …");
        var given = new RecordingInput(paths.Edf, Path.GetFileName(paths.Edf), Path.GetFileNameWithoutExtension(paths.Edf), Path.GetFileNameWithoutExtension(paths.Edf));
        var input = report?.Privacy?.Apply(given) ?? given;
        var summary = RecordingSummariser.Summarise(input, Path.Combine(folder, "out"), new SummaryOptions { Report = report ?? ReportOptions.Default });
        stdout.WriteLine(FormattableString.Invariant($"{summary.Beats} beats over {summary.DurationS / 3600:0.##} h → {summary.OutputFolder}"));
        stdout.WriteLine($"report     {Path.Combine(summary.OutputFolder, ReportOutputs.PdfName)}");
        return ExitCode.Ok;
    }
}
