using System.Diagnostics;

namespace LongRecord.Reporting.Tests.Support;

/// <summary>Runs the poppler-utils tools (pdfinfo, pdftotext, pdftoppm); a missing tool fails the test saying what to install.</summary>
public static class Poppler
{
    public static string Run(string tool, params string[] args)
    {
        var start = new ProcessStartInfo(tool) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (var a in args)
        {
            start.ArgumentList.Add(a);
        }

        Process process;
        try
        {
            process = Process.Start(start) ?? throw new InvalidOperationException($"{tool} did not start");
        }
        catch (System.ComponentModel.Win32Exception)
        {
            throw new InvalidOperationException($"{tool} not found: install poppler-utils (apt-get install poppler-utils; .ci/run does it)");
        }

        using (process)
        {
            var output = process.StandardOutput.ReadToEndAsync();
            var error = process.StandardError.ReadToEnd();
            process.WaitForExit();
            if (process.ExitCode != 0)
            {
                throw new InvalidOperationException($"{tool} {string.Join(' ', args)} failed ({process.ExitCode}): {error}");
            }

            return output.Result;
        }
    }

    /// <summary>Text of pages <paramref name="first"/> … <paramref name="last"/> (1-based), layout kept.</summary>
    public static string Text(string pdf, int first = 1, int last = 1) => Run("pdftotext", "-layout", "-f", $"{first}", "-l", $"{last}", pdf, "-");

    public static int Pages(string pdf)
    {
        var info = Run("pdfinfo", pdf);
        var line = info.Split('\n').First(l => l.StartsWith("Pages:", StringComparison.Ordinal));
        return int.Parse(line["Pages:".Length..].Trim(), System.Globalization.CultureInfo.InvariantCulture);
    }
}
