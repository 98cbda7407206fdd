using System.Diagnostics;
using LongRecord.Pipeline;

namespace LongRecord.Benchmarks.Analysis;

/// <summary>
/// The rhythm issue's data-set figure: every LTAFDB record present re-analysed from its <c>.qrs</c> beats (read, rhythm,
/// episodes — no signal), one record after another on one thread, timed as a whole.
/// </summary>
public static class LtafdbRhythmRun
{
    public static void Run()
    {
        var folder = Path.Combine(SharedDataRoot() ?? "../shared/data", "physionet", "ltafdb");
        if (!Directory.Exists(folder))
        {
            Console.WriteLine($"benchmark LTAFDB: {Path.GetFullPath(folder)} not found (set LONGRECORD_SHARED_DATA)");
            return;
        }

        var headers = Directory.GetFiles(folder, "*.hea").Order(StringComparer.Ordinal).ToArray();
        long beats = 0;
        var sw = Stopwatch.StartNew();
        foreach (var header in headers)
        {
            beats += RecordingSummariser.Analyse(header, new SummaryOptions { Beats = "qrs" }).Beats.Count;
        }

        Console.WriteLine(FormattableString.Invariant(
            $"benchmark LTAFDB from .qrs beats: {headers.Length} records, {beats / 1e6:F2} M beats in {sw.Elapsed.TotalSeconds:F1} s (read, rhythm and episodes; one thread; target < 20 s)"));
    }

    // As the tests find it: LONGRECORD_SHARED_DATA, else a shared/data folder beside a parent of this program's folder.
    private static string? SharedDataRoot()
    {
        if (Environment.GetEnvironmentVariable("LONGRECORD_SHARED_DATA") is { Length: > 0 } set)
        {
            return set;
        }

        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "shared", "data");
            if (Directory.Exists(candidate))
            {
                return candidate;
            }
        }

        return null;
    }
}
