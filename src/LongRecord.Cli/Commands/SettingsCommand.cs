using System.CommandLine;
using LongRecord.Analysis.Settings;

namespace LongRecord.Cli.Commands;

/// <summary><c>longrecord settings</c>: prints the default analysis settings as JSON, a starting point for <c>--settings</c>.</summary>
public static class SettingsCommand
{
    public static Command Create(TextWriter stdout, TextWriter stderr)
    {
        var check = new Option<FileInfo?>("--check") { Description = "Check a settings file instead: list every problem in it, or print it with the defaults filled in" };
        var cmd = new Command("settings", "Print the default analysis thresholds as JSON (edit and pass with summarise --settings)") { check };
        cmd.SetAction(parse => CommandRunner.Run(stderr, () =>
        {
            var settings = SummariseCommand.LoadSettings(parse.GetValue(check)) ?? AnalysisSettings.Default;
            stdout.WriteLine(settings.ToJson());
            return ExitCode.Ok;
        }));
        return cmd;
    }
}
