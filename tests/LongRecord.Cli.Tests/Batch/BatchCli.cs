using LongRecord.Pipeline.Batch;

namespace LongRecord.Cli.Tests.Batch;

/// <summary>Runs <c>longrecord</c> in the test process, and reads a batch's index back.</summary>
internal static class BatchCli
{
    public static (int Code, string Stdout, string Stderr) Run(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        return (Program.Run(args, o, e), o.ToString(), e.ToString());
    }

    /// <summary>A synthetic recording of a built-in scenario (fixtures/scenarios), with its truth beside it.</summary>
    public static void Synth(string scenario, string path, double? hours = null, int? seed = null)
    {
        var args = new List<string> { "synth", scenario, "--out", path };
        if (hours is double h)
        {
            args.AddRange(["--hours", h.ToString(System.Globalization.CultureInfo.InvariantCulture)]);
        }

        if (seed is int s)
        {
            args.AddRange(["--seed", s.ToString(System.Globalization.CultureInfo.InvariantCulture)]);
        }

        var (code, _, stderr) = Run([.. args]);
        Assert.True(code == 0, stderr);
    }

    /// <summary>index.csv (or a shard's index) as rows keyed by column name.</summary>
    public static IReadOnlyList<Dictionary<string, string>> Index(string outputRoot, string name = "index.csv")
    {
        var lines = File.ReadAllLines(Path.Combine(outputRoot, name));
        var header = IndexFigures.SplitCsv(lines[0]);
        return lines.Skip(1).Select(l =>
        {
            var cells = IndexFigures.SplitCsv(l);
            Assert.Equal(header.Length, cells.Length);
            return header.Zip(cells).ToDictionary(p => p.First, p => p.Second);
        }).ToArray();
    }

    /// <summary>Folders a killed or failed run could leave: anything hidden in the output root.</summary>
    public static string[] HiddenEntries(string outputRoot) =>
        Directory.GetFileSystemEntries(outputRoot).Select(Path.GetFileName).Where(n => n!.StartsWith('.')).ToArray()!;
}
