using System.CommandLine;
using System.Globalization;
using LongRecord.Synthesis;
using LongRecord.Synthesis.Export;

namespace LongRecord.Cli.Commands;

/// <summary><c>longrecord synth SCENARIO --out FILE [--hours H] [--seed N] [--rate HZ]</c>: a synthetic recording with exact truth.</summary>
public static class SynthCommand
{
    public static Command Create(TextWriter stdout, TextWriter stderr)
    {
        var scenario = new Argument<string>("SCENARIO") { Description = $"Scenario JSON file, or a built-in scenario: {string.Join(", ", ScenarioCatalogue.Names)}" };
        var output = new Option<FileInfo>("--out", "-o") { Description = "EDF+ file to write; its truth goes beside it as NAME.atr and NAME.truth.json", Required = true };
        var hours = new Option<double?>("--hours") { Description = "Repeat or cut the scenario's timeline to this many hours (at most 336)" };
        var seed = new Option<ulong?>("--seed") { Description = "Random seed (default: the scenario's); the same seed gives the same bytes" };
        var rate = new Option<int?>("--rate") { Description = "Sampling rate in Hz, 100–1000 (default: the scenario's)" };
        var cmd = new Command("synth", "Synthesise a multi-lead ECG recording (EDF+) with beat-by-beat ground truth") { scenario, output, hours, seed, rate };
        cmd.SetAction(parse => CommandRunner.Run(stderr, () =>
        {
            var paths = Run(parse.GetValue(scenario)!, parse.GetValue(output)!.ToString(), parse.GetValue(hours), parse.GetValue(seed), parse.GetValue(rate));
            stdout.WriteLine(paths.Edf);
            return ExitCode.Ok;
        }));
        return cmd;
    }

    public static SyntheticExportPaths Run(string scenario, string output, double? hours, ulong? seed, int? rateHz, CancellationToken cancellation = default)
    {
        if (hours is <= 0 or > 336)
        {
            throw new UserInputException(FormattableString.Invariant($"--hours must be above 0 and at most 336 (is {hours})"));
        }

        if (rateHz is < 100 or > 1000)
        {
            throw new UserInputException(string.Create(CultureInfo.InvariantCulture, $"--rate must be 100 to 1000 Hz (is {rateHz})"));
        }

        var loaded = ScenarioCatalogue.Load(scenario);
        var recording = SyntheticRecording.Create(loaded, new SynthesisOptions { Hours = hours, Seed = seed, SamplingRateHz = rateHz });
        return SyntheticRecordingExport.Write(recording, output, cancellation);
    }
}
