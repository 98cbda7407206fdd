using System.CommandLine;
using LongRecord.Analysis.Settings;
using LongRecord.Formats;
using LongRecord.Cli.Progress;
using LongRecord.Pipeline;
using LongRecord.Pipeline.Batch;
using LongRecord.Pipeline.Inputs;

namespace LongRecord.Cli.Commands;

/// <summary>
/// <c>longrecord summarise INPUT… --out DIR</c>: every recording named or found under a folder is analysed into its own
/// folder <c>DIR/&lt;recording name&gt;/</c>, several at once, skipping those whose fingerprint matches, with an index
/// of them all. One bad recording gets one error line and the others go on. The work is in <see cref="BatchRunner"/>.
/// </summary>
public static class SummariseCommand
{
    public static Command Create(TextWriter stdout, TextWriter stderr)
    {
        var inputs = new Argument<string[]>("INPUT") { Description = "Recordings, or folders to search for them (WFDB records by their headers; EDF, BDF, ISHNE, CSV by content)", Arity = ArgumentArity.OneOrMore }.RejectUnknownOptions();
        var output = new Option<DirectoryInfo>("--out", "-o") { Description = "Output folder: one sub-folder per recording", Required = true };
        var beats = new Option<string?>("--beats") { Description = "Take beats from an annotation file instead of detecting them: an annotator beside each record's header (qrs, atr, ecg) or a file (WFDB annotations, or a CSV of R times with a time_s or sample column)" };
        var settings = new Option<FileInfo?>("--settings") { Description = "JSON file of analysis thresholds (tachycardia rate, pause lengths, minimum AF episode, windows…); every problem in it is listed before any recording is read. Default: the documented values" };
        var diary = new Option<FileInfo?>("--diary") { Description = "Patient diary (CSV with columns time,text; time in seconds from the start or as a local date-time) instead of <recording name>.diary.csv beside each recording: the rhythm and rate at each entry are reported" };
        var block = new Option<int?>("--block-seconds") { Description = "Seconds of signal read and analysed at a time (results do not depend on it; default about 4 min at 250 Hz)", Hidden = true };
        var jobs = new Option<int>("--jobs", "-j") { Description = "Recordings analysed at once (default: the number of cores)", DefaultValueFactory = _ => Environment.ProcessorCount };
        var shard = new Option<string?>("--shard") { Description = "I/N: take only the I-th of N parts of the whole sorted input list (output folder names as in a run without it), for a scheduler's array job" };
        var force = new Option<bool>("--force") { Description = "Analyse every recording again, even those whose outputs are up to date" };
        var quiet = new Option<bool>("--quiet", "-q") { Description = "Print errors only" };
        var verbose = new Option<bool>("--verbose", "-v") { Description = "Also say when each analysis starts and why it runs" };
        var timings = new Option<bool>("--timings") { Description = "Print the time spent in each stage, per recording and for the batch" };
        var cmd = new Command("summarise", "Analyse recordings as a batch: beats and rhythm per recording and an index of them all; resumable, and one recording's failure stops no other")
        {
            inputs, output, beats, settings, diary, block, jobs, shard, force, quiet, verbose, timings,
        };
        var report = new ReportCommandOptions();
        report.AddTo(cmd);
        jobs.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<int>() < 1)
            {
                r.AddError("--jobs must be at least 1");
            }
        });
        cmd.Validators.Add(r =>
        {
            if (r.GetValue(quiet) && r.GetValue(verbose))
            {
                r.AddError("--quiet and --verbose cannot be used together");
            }

            if (r.GetValue(shard) is string text && !ShardSpec.TryParse(text, out _, out var problem))
            {
                r.AddError(problem);
            }
        });
        cmd.SetAction((parse, cancellation) => Task.FromResult(CommandRunner.Run(stderr, () =>
        {
            var options = new SummaryOptions { Beats = parse.GetValue(beats), Settings = LoadSettings(parse.GetValue(settings)), Report = report.Resolve(parse), Diary = DiaryPath(parse.GetValue(diary)) };
            if (parse.GetValue(block) is int s)
            {
                options = options with { BlockSamples = Math.Max(1, s * 250) };
            }

            ShardSpec.TryParse(parse.GetValue(shard) ?? "1/1", out var part, out _);
            var batch = new BatchOptions { Jobs = parse.GetValue(jobs), Shard = part, Force = parse.GetValue(force) };
            var level = parse.GetValue(quiet) ? ProgressLevel.Quiet : parse.GetValue(verbose) ? ProgressLevel.Verbose : ProgressLevel.Normal;
            return Run(parse.GetValue(inputs)!, parse.GetValue(output)!.ToString(), options, batch, new ProgressSettings(level, parse.GetValue(timings)), stdout, stderr, cancellation);
        })));
        return cmd;
    }

    /// <summary>Reads the settings file; a missing file or any problem in it is a user error listing every problem.</summary>
    public static AnalysisSettings? LoadSettings(FileInfo? file)
    {
        if (file is null)
        {
            return null;
        }

        if (!file.Exists)
        {
            throw new UserInputException($"{file}: settings file not found");
        }

        try
        {
            return AnalysisSettings.Load(File.ReadAllText(file.FullName), file.ToString());
        }
        catch (AnalysisSettingsException e)
        {
            throw new UserInputException(e.Message);
        }
    }

    /// <summary>The diary file named on the command line; a missing file is a user error.</summary>
    public static string? DiaryPath(FileInfo? file) =>
        file is null ? null : file.Exists ? file.FullName : throw new UserInputException($"{file}: diary file not found");

    /// <summary>Finds the recordings and runs them as a batch (<see cref="BatchRunner"/>) with the display that suits the output.</summary>
    public static ExitCode Run(IReadOnlyList<string> inputs, string outputRoot, SummaryOptions options, BatchOptions batch, ProgressSettings progress, TextWriter stdout, TextWriter stderr, CancellationToken cancellation = default)
    {
        var found = RecordingDiscovery.Find(inputs);
        if (found.Count == 0)
        {
            throw new UserInputException($"{string.Join(", ", inputs)}: no recordings found");
        }

        // Under --deidentify every recording is its pseudonym from here on: folders, index, logs and error lines.
        if (options.Report.Privacy is { } privacy)
        {
            found = found.Select(privacy.Apply).ToList();
        }

        var result = BatchDisplay.Run(stdout, stderr, progress, display => BatchRunner.Run(found, outputRoot, batch with { Summary = options }, display, cancellation));
        if (result.AnyInternalFault)
        {
            return ExitCode.Internal;
        }

        // A single recording that fails is plain bad input; in a batch, the others were done.
        return result.Failed == 0 ? ExitCode.Ok : found.Count == 1 ? ExitCode.BadInput : ExitCode.SomeFailed;
    }
}
