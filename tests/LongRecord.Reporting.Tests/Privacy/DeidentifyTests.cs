using System.Text;
using System.Text.Json;
using LongRecord.Reporting.Tests.Support;
using LongRecord.TestSupport;

namespace LongRecord.Reporting.Tests.Privacy;

/// <summary>
/// <c>--deidentify</c> on a recording whose EDF+ header holds the invented patient's name, ID and birth date
/// (fixtures/scenarios/demo-24h.json) and whose file is named by the patient ID, as clinics often name them.
/// </summary>
public sealed class DeidentifyTests
{
    // The identity as the scenario gives it, and as the EDF+ patient field writes it (spaces as underscores, dd-MMM-yyyy).
    private static readonly string[] s_identity =
        ["Elowen", "Marchetti", "Marchetti-Brandt", "SLC-2026-0417", "1957-11-23", "23-NOV-1957", "Elowen_Marchetti-Brandt"];

    [Fact]
    public void NoNameIdOrBirthDate_InAnyOutputFileFolderOrMessage_AndTheMappingOnlyInTheKeyFile()
    {
        using var folder = new TempFolder("deid");
        var input = folder.Path("in");
        Directory.CreateDirectory(input);
        var edf = Path.Combine(input, "SLC-2026-0417.edf");
        CommandLine.Check("synth", "demo-24h", "--out", edf, "--hours", "0.1");
        var keyFile = folder.Path("secret/key.json");
        Directory.CreateDirectory(folder.Path("secret"));
        var (code, stdout, stderr) = CommandLine.Run("summarise", input, "--out", folder.Path("out"), "--deidentify", "--key-file", keyFile);
        Assert.True(code == 0, stderr);
        AssertClean("stdout", stdout);
        AssertClean("stderr", stderr);

        var outputs = Directory.GetFileSystemEntries(folder.Path("out"), "*", SearchOption.AllDirectories);
        Assert.Contains(outputs, f => f.EndsWith("report.pdf", StringComparison.Ordinal));
        foreach (var path in outputs)
        {
            AssertClean("path " + path, Path.GetRelativePath(folder.Path("out"), path));
            if (File.Exists(path))
            {
                AssertClean(path, File.ReadAllText(path, Encoding.Latin1));
                if (path.EndsWith(".pdf", StringComparison.Ordinal))
                {
                    // PDF text sits in compressed streams: read it back as text with an independent reader too.
                    AssertClean(path + " (text)", Poppler.Text(path, 1, Poppler.Pages(path)));
                }
            }
        }

        // The key file keeps the mapping back to the patient, and nothing else does.
        var key = JsonDocument.Parse(File.ReadAllText(keyFile)).RootElement;
        var entry = Assert.Single(key.GetProperty("pseudonyms").EnumerateArray());
        Assert.Equal("Elowen Marchetti-Brandt", entry.GetProperty("patient_name").GetString());
        Assert.Equal("SLC-2026-0417", entry.GetProperty("patient_id").GetString());
        Assert.Equal("SLC-2026-0417.edf", entry.GetProperty("relative_path").GetString());
        var pseudonym = entry.GetProperty("pseudonym").GetString()!;
        Assert.True(Directory.Exists(folder.Path(Path.Combine("out", pseudonym))));
    }

    [Fact]
    public void ReanalysisFromABeatsFileNamedByThePatient_NoNameOrIdInAnyOutput()
    {
        using var folder = new TempFolder("deid");
        var edf = folder.Path("Marchetti-Brandt SLC-2026-0417.edf");
        CommandLine.Check("synth", "sinus-rest", "--out", edf, "--hours", "0.02");
        // The synthesiser writes its truth beside the recording as NAME.atr: a beats file whose name is the patient's.
        var beats = Path.ChangeExtension(edf, ".atr");
        var (code, stdout, stderr) = CommandLine.Run("summarise", edf, "--out", folder.Path("out"), "--deidentify", "--beats", beats);
        Assert.True(code == 0, stderr);
        AssertClean("stdout", stdout);
        AssertClean("stderr", stderr);
        foreach (var path in Directory.GetFiles(folder.Path("out"), "*", SearchOption.AllDirectories))
        {
            AssertClean("path " + path, Path.GetRelativePath(folder.Path("out"), path));
            AssertClean(path, File.ReadAllText(path, Encoding.Latin1));
            if (path.EndsWith(".pdf", StringComparison.Ordinal))
            {
                AssertClean(path + " (text)", Poppler.Text(path, 1, Poppler.Pages(path)));
            }
        }
    }

    [Fact]
    public void SameKeyFile_SamePseudonym_AcrossRuns_OtherKey_OtherPseudonym()
    {
        using var folder = new TempFolder("deid");
        var edf = folder.Path("SLC-2026-0417.edf");
        CommandLine.Check("synth", "sinus-rest", "--out", edf, "--hours", "0.02");
        var key = folder.Path("key.json");
        CommandLine.Check("summarise", edf, "--out", folder.Path("a"), "--deidentify", "--key-file", key);
        CommandLine.Check("summarise", edf, "--out", folder.Path("b"), "--deidentify", "--key-file", key);
        CommandLine.Check("summarise", edf, "--out", folder.Path("c"), "--deidentify", "--key-file", folder.Path("other-key.json"));
        var a = Assert.Single(Directory.GetDirectories(folder.Path("a"))).Split('/')[^1];
        var b = Assert.Single(Directory.GetDirectories(folder.Path("b"))).Split('/')[^1];
        var c = Assert.Single(Directory.GetDirectories(folder.Path("c"))).Split('/')[^1];
        Assert.StartsWith("anon-", a);
        Assert.Equal(a, b);
        Assert.NotEqual(a, c);
    }

    [Fact]
    public void BadInput_ErrorLineNamesThePseudonym_NotTheFile()
    {
        using var folder = new TempFolder("deid");
        var bad = folder.Write("SLC-2026-0417.edf", "0       not an EDF header at all"u8.ToArray());
        var (code, _, stderr) = CommandLine.Run("summarise", bad, "--out", folder.Path("out"), "--deidentify");
        Assert.Equal(2, code);
        var line = Assert.Single(stderr.Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.StartsWith("anon-", line);
        AssertClean("stderr", stderr);
    }

    [Fact]
    public void KeyFileWithoutDeidentify_IsAUsageError()
    {
        using var folder = new TempFolder("deid");
        var (code, _, stderr) = CommandLine.Run("summarise", folder.FullPath, "--out", folder.Path("out"), "--key-file", folder.Path("k.json"));
        Assert.Equal(2, code);
        Assert.Contains("--deidentify", stderr);
    }

    private static void AssertClean(string where, string text)
    {
        foreach (var s in s_identity)
        {
            Assert.False(text.Contains(s, StringComparison.OrdinalIgnoreCase), $"{where} contains \"{s}\"");
        }
    }
}
