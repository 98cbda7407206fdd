using System.Collections.Concurrent;

namespace LongRecord.Pipeline.Tests;

/// <summary>
/// Collects the figures the checks measured and prints them as one table when the test run ends (the issues ask for
/// the figures at the end of the run; the README's results section is copied from it).
/// </summary>
public static class FiguresReport
{
    private static readonly ConcurrentDictionary<string, string> s_lines = new();

    static FiguresReport()
    {
        AppDomain.CurrentDomain.ProcessExit += (_, _) => Flush();
    }

    /// <summary>
    /// Writes the table to <c>TestResults/figures.txt</c> at the repository root (which <c>.ci/run</c> prints after the
    /// tests) and to standard output (shown by <c>dotnet test --logger "console;verbosity=normal"</c>).
    /// </summary>
    private static void Flush()
    {
        Print(Console.Out);
        var root = RepositoryRoot();
        if (root is null || s_lines.IsEmpty)
        {
            return;
        }

        var dir = Path.Combine(root, "TestResults");
        Directory.CreateDirectory(dir);
        using var w = new StreamWriter(Path.Combine(dir, "figures.txt"));
        Print(w);
    }

    private static string? RepositoryRoot()
    {
        for (var d = new DirectoryInfo(AppContext.BaseDirectory); d is not null; d = d.Parent)
        {
            if (File.Exists(Path.Combine(d.FullName, "LongRecord.sln")))
            {
                return d.FullName;
            }
        }

        return null;
    }

    public static void Add(string key, string text) => s_lines[key] = text;

    public static void Print(TextWriter o)
    {
        if (s_lines.IsEmpty)
        {
            return;
        }

        o.WriteLine();
        o.WriteLine("==== LongRecord figures (this run) ====");
        foreach (var (_, text) in s_lines.OrderBy(kv => kv.Key, StringComparer.Ordinal))
        {
            o.WriteLine(text.TrimEnd());
        }

        o.WriteLine("=======================================");
    }
}
