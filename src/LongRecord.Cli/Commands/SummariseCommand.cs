using System.CommandLine;
using System.Globalization;
using LongRecord.Analysis.Settings;
using LongRecord.Formats;
using LongRecord.Pipeline;
using LongRecord.Pipeline.Inputs;

namespace LongRecord.Cli.Commands;

/// <summary>
/// <c>longrecord summarise INPUT… --out DIR</c>: every recording named or found under a folder is analysed into its own
/// folder <c>DIR/&lt;recording name&gt;/</c>. One bad recording gets one error line and the others go on.
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
        var cmd = new Command("summarise", "Analyse recordings: beats (beats.csv, a WFDB annotation file) per recording") { inputs, output, beats, settings, diary, block };
        cmd.SetAction(parse => CommandRunner.Run(stderr, () =>
            Run(parse.GetValue(inputs)!, parse.GetValue(output)!.ToString(), parse.GetValue(beats), LoadSettings(parse.GetValue(settings)), parse.GetValue(block), stdout, stderr,
                DiaryPath(parse.GetValue(diary)))));
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

    public static ExitCode Run(IReadOnlyList<string> inputs, string outputRoot, string? beats, AnalysisSettings? settings, int? blockSeconds, TextWriter stdout, TextWriter stderr,
        string? diary = null)
    {
        var found = RecordingDiscovery.Find(inputs);
        if (found.Count == 0)
        {
            throw new UserInputException($"{string.Join(", ", inputs)}: no recordings found");
        }

        var failed = 0;
        foreach (var input in found)
        {
            try
            {
                var options = new SummaryOptions { Beats = beats, Settings = settings, Diary = diary };
                if (blockSeconds is int s)
                {
                    options = options with { BlockSamples = Math.Max(1, s * 250) };
                }

                var summary = RecordingSummariser.Summarise(input, outputRoot, options);
                stdout.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"{input.RelativePath}: {summary.Beats} beats over {summary.DurationS / 3600:0.##} h, {(summary.SignalAnalysed ? $"{summary.Leads} lead(s) at {summary.ReferenceRateHz:0.###} Hz" : "from annotations only, no signal")}{(summary.BeatSource == "detected" ? "" : $" (beats from {Path.GetFileName(summary.BeatSource)})")} → {summary.OutputFolder}"));
            }
            catch (RecordingFormatException e)
            {
                stderr.WriteLine(e.Message);
                failed++;
            }
        }

        return failed == 0 ? ExitCode.Ok : found.Count == 1 ? ExitCode.BadInput : ExitCode.SomeFailed;
    }
}
