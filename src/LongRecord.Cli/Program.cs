using System.CommandLine;
using LongRecord.Cli.Commands;

namespace LongRecord.Cli;

public static class Program
{
    public static int Main(string[] args) => Run(args, Console.Out, Console.Error);

    /// <summary>Parses and runs one command line; the writers stand in for the console in tests.</summary>
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        var root = new RootCommand("LongRecord: overnight analysis of long ambulatory ECG recordings (Holter, patch).")
        {
            InspectCommand.Create(stdout, stderr),
            SynthCommand.Create(stdout, stderr),
            SummariseCommand.Create(stdout, stderr),
            SettingsCommand.Create(stdout, stderr),
            DemoCommand.Create(stdout, stderr),
        };
        var parse = root.Parse(args);
        return parse.Invoke(new InvocationConfiguration { Output = stdout, Error = stderr });
    }
}
