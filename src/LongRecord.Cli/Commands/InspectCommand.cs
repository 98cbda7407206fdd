using System.CommandLine;
using System.Globalization;
using LongRecord.Formats;
using LongRecord.Formats.Survey;

namespace LongRecord.Cli.Commands;

/// <summary><c>longrecord inspect FILE…</c>: what a recording holds, before any analysis.</summary>
public static class InspectCommand
{
    private static readonly CultureInfo s_inv = CultureInfo.InvariantCulture;

    public static Command Create(TextWriter stdout, TextWriter stderr)
    {
        var files = new Argument<FileInfo[]>("FILE") { Description = "Recordings to describe (EDF/EDF+/BDF, WFDB header, ISHNE, CSV)", Arity = ArgumentArity.OneOrMore }.RejectUnknownOptions();
        var noSurvey = new Option<bool>("--no-survey") { Description = "Skip the pass over every sample (flat-line and saturation percentages)" };
        var cmd = new Command("inspect", "Describe recordings: format, leads, rates, start, duration, gaps, events, flat-line and saturation per lead") { files, noSurvey };
        cmd.SetAction(parse => Run(parse.GetValue(files)!, !parse.GetValue(noSurvey), stdout, stderr));
        return cmd;
    }

    /// <summary>Describes each file; a file that cannot be read gets its one-line error and the others go on.</summary>
    public static int Run(IReadOnlyList<FileInfo> files, bool survey, TextWriter stdout, TextWriter stderr)
    {
        var worst = ExitCode.Ok;
        foreach (var f in files)
        {
            var code = (ExitCode)CommandRunner.Run(stderr, () =>
            {
                using var reader = RecordingOpener.Open(f.ToString());
                Describe(reader, survey, stdout);
                return ExitCode.Ok;
            });
            if (code != ExitCode.Ok)
            {
                worst = code;
            }
        }

        return (int)worst;
    }

    public static void Describe(IRecordingReader reader, bool survey, TextWriter o)
    {
        var info = reader.Info;
        o.WriteLine($"{info.FilePath}");
        o.WriteLine($"  format     {info.FormatDetail}");
        o.WriteLine($"  start      {FormatStart(info)}");
        o.WriteLine($"  duration   {FormatDuration(info.DurationS)} ({info.DurationS.ToString("0.###", s_inv)} s)");
        if (!info.HasSignal)
        {
            o.WriteLine($"  signal     {info.NoSignalReason ?? "none"}");
        }

        var surveys = survey && info.HasSignal ? SignalSurvey.Run(reader) : null;
        o.WriteLine($"  leads      {info.Channels.Count}");
        if (info.Channels.Count > 0)
        {
            o.WriteLine($"    {"#",-3} {"label",-16} {"unit",-6} {"rate Hz",9} {"samples",12} {"step",10}{(surveys is null ? "" : $" {"flat %",7} {"sat %",7} {"missing %",9}")}");
        }

        for (var i = 0; i < info.Channels.Count; i++)
        {
            var c = info.Channels[i];
            var step = c.Resolution.ToString("G4", s_inv) + (c.IsVoltage ? " mV" : "");
            var line = $"    {i,-3} {Trim(c.Label, 16),-16} {Trim(c.PhysicalUnit, 6),-6} {c.SamplingRateHz.ToString("0.###", s_inv),9} {c.SampleCount,12} {step,10}";
            if (surveys is not null)
            {
                var s = surveys[i];
                line += $" {s.FlatPercent.ToString("0.00", s_inv),7} {s.SaturatedPercent.ToString("0.00", s_inv),7} {s.MissingPercent.ToString("0.00", s_inv),9}";
            }

            o.WriteLine(line);
        }

        o.WriteLine($"  gaps       {info.Gaps.Count}");
        foreach (var g in info.Gaps.Take(20))
        {
            o.WriteLine($"    at {g.StartS.ToString("0.###", s_inv)} s for {g.DurationS.ToString("0.###", s_inv)} s");
        }

        o.WriteLine($"  events     {info.Events.Count}");
        foreach (var e in info.Events.Take(20))
        {
            var d = e.DurationS is double dd ? $" ({dd.ToString("0.###", s_inv)} s)" : "";
            o.WriteLine($"    {e.OnsetS.ToString("0.###", s_inv),10} s{d}  {Trim(e.Text, 60)}");
        }

        if (info.Events.Count > 20)
        {
            o.WriteLine($"    … {info.Events.Count - 20} more");
        }
    }

    private static string FormatStart(RecordingInfo info) => (info.StartDate, info.StartTime) switch
    {
        (DateOnly d, TimeOnly t) => $"{d.ToString("yyyy-MM-dd", s_inv)} {t.ToString("HH:mm:ss", s_inv)} (as recorded)",
        (null, TimeOnly t) => $"{t.ToString("HH:mm:ss", s_inv)}, no date (as recorded)",
        (DateOnly d, null) => $"{d.ToString("yyyy-MM-dd", s_inv)}, no time (as recorded)",
        _ => "not recorded: times are elapsed from the first sample",
    };

    private static string FormatDuration(double s)
    {
        var t = TimeSpan.FromSeconds(Math.Round(s));
        return $"{(int)t.TotalHours}:{t.Minutes:00}:{t.Seconds:00}";
    }

    private static string Trim(string s, int n) => s.Length <= n ? s : s[..(n - 1)] + "…";
}
