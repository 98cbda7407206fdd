using System.Diagnostics;
using System.Globalization;

namespace LongRecord.Formats.Tests.Edf;

/// <summary>
/// Runs BioSig's <c>save2gdf -f=ASCII</c> (Debian package biosig-tools), an EDF reader independent of ours, and parses its
/// output: a header file with one "[Header 2]" block per channel and one text file of physical values per channel.
/// </summary>
internal static class Save2Gdf
{
    public sealed record Channel(string Label, string Unit, double SamplingRateHz, long SampleCount, double PhysMin, double PhysMax,
        double DigMin, double DigMax, string[] Values);

    public sealed record Event(double OnsetS, double DurationS, string Text);

    public sealed record Output(IReadOnlyList<Channel> Channels, IReadOnlyList<Event> Events);

    public static string Executable()
    {
        foreach (var dir in (Environment.GetEnvironmentVariable("PATH") ?? "").Split(Path.PathSeparator).Append("/usr/bin"))
        {
            var candidate = Path.Combine(dir, "save2gdf");
            if (File.Exists(candidate))
            {
                return candidate;
            }
        }

        Assert.Fail("save2gdf not found: the independent EDF check needs BioSig's tools; install them with 'apt-get install biosig-tools'");
        return "";
    }

    public static Output Convert(string edfPath, string outputFolder)
    {
        Directory.CreateDirectory(outputFolder);
        var destination = Path.Combine(outputFolder, "out");
        var start = new ProcessStartInfo(Executable(), ["-f=ASCII", edfPath, destination])
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        using var process = Process.Start(start)!;
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(60_000))
        {
            process.Kill();
            Assert.Fail("save2gdf did not finish within 60 s");
        }

        Assert.True(process.ExitCode == 0, $"save2gdf exit code {process.ExitCode}: {stdout.Result} {stderr.Result}");
        return Parse(destination);
    }

    private static Output Parse(string headerPath)
    {
        var channels = new List<Channel>();
        var events = new List<Event>();
        Dictionary<string, string>? block = null;
        var inEvents = false;
        foreach (var line in File.ReadLines(headerPath))
        {
            if (line.StartsWith("[EVENT TABLE]", StringComparison.Ordinal))
            {
                Finish();
                inEvents = true;
                continue;
            }

            if (inEvents)
            {
                var cells = line.Split('\t');
                if (cells.Length >= 5 && cells[0].StartsWith("0x", StringComparison.Ordinal))
                {
                    events.Add(new Event(Num(cells[1]), Num(cells[2]), string.Join('\t', cells[4..])));
                }

                continue;
            }

            var eq = line.IndexOf('=');
            if (eq < 0)
            {
                continue;
            }

            var key = line[..eq].Trim();
            var value = line[(eq + 1)..];
            var hash = value.IndexOf("\t#", StringComparison.Ordinal);
            value = (hash >= 0 ? value[..hash] : value).Trim();
            if (key == "Filename" && value.Contains(".a", StringComparison.Ordinal))
            {
                Finish();
                block = new Dictionary<string, string>();
            }

            if (block is not null)
            {
                block[key] = value;
            }
        }

        Finish();
        return new Output(channels, events);

        void Finish()
        {
            if (block is null)
            {
                return;
            }

            channels.Add(new Channel(block["Label"], block["PhysicalUnits"], Num(block["SamplingRate"]), (long)Num(block["NumberOfSamples"]),
                Num(block["PhysMin"]), Num(block["PhysMax"]), Num(block["DigMin"]), Num(block["DigMax"]),
                File.ReadAllLines(block["Filename"]).Where(l => l.Length > 0).ToArray()));
            block = null;
        }
    }

    private static double Num(string text) => double.Parse(text.Trim(), NumberStyles.Float, CultureInfo.InvariantCulture);

    /// <summary>
    /// Half a unit in the 6th significant digit of <paramref name="value"/>: save2gdf prints values with C's %g, which keeps
    /// 6 significant digits (and drops trailing zeros), so that is the precision its text carries.
    /// </summary>
    public static double HalfSixthDigit(double value) =>
        value == 0 ? 0 : 0.5 * Math.Pow(10, Math.Floor(Math.Log10(Math.Abs(value))) - 5);

    public static double Number(string text) => Num(text);
}
