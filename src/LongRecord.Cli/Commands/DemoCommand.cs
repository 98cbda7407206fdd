using System.CommandLine;
using LongRecord.Formats;

namespace LongRecord.Cli.Commands;

/// <summary>
/// <c>longrecord demo [--out DIR]</c>: writes the built-in 24 h two-lead demo recording of an invented patient into a
/// demo folder and describes it.
/// </summary>
public static class DemoCommand
{
    public const string Scenario = "demo-24h";

    public static Command Create(TextWriter stdout, TextWriter stderr)
    {
        var output = new Option<DirectoryInfo>("--out", "-o") { Description = "Folder for the demo files (default: ./longrecord-demo)" };
        var hours = new Option<double?>("--hours") { Description = "Shorten or lengthen the demo day (hours; default 24)" };
        var cmd = new Command("demo", "Synthesise the 24 h demo recording of an invented patient and describe it") { output, hours };
        cmd.SetAction(parse => CommandRunner.Run(stderr, () =>
        {
            var dir = parse.GetValue(output)?.ToString() ?? "longrecord-demo";
            return Run(dir, parse.GetValue(hours), stdout);
        }));
        return cmd;
    }

    public static ExitCode Run(string folder, double? hours, TextWriter stdout)
    {
        var edf = Path.Combine(folder, "demo-patient.edf");
        stdout.WriteLine($"synthesising the demo day into {folder} …");
        var paths = SynthCommand.Run(Scenario, edf, hours, seed: null, rateHz: null);
        stdout.WriteLine($"recording  {paths.Edf}");
        stdout.WriteLine($"truth      {paths.Annotations} (WFDB annotations), {paths.Truth}");
        stdout.WriteLine();
        using var reader = RecordingOpener.Open(paths.Edf);
        InspectCommand.Describe(reader, survey: true, stdout);
        return ExitCode.Ok;
    }
}
