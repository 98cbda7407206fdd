using LongRecord.Formats.Csv;
using LongRecord.Formats.Tests.Csv;
using LongRecord.Formats.Tests.Edf;
using LongRecord.Formats.Tests.Ishne;
using LongRecord.Formats.Tests.Wfdb;
using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Recording;

/// <summary>
/// Every format's broken-file corpus opened the way the CLI opens files — through content-based detection — must give
/// one <see cref="RecordingFormatException"/> whose one-line message names the file and the case's own problem.
/// (Foundation issue, "Bad input": at least 25 broken files, each with its own specific message.)
/// </summary>
public sealed class BrokenCorpusTests
{
    public static IEnumerable<BrokenFile> All() =>
        EdfBrokenCorpus.Build().Concat(WfdbBrokenCorpus.Build()).Concat(IshneBrokenCorpus.Build()).Concat(CsvBrokenCorpus.Build());

    public static TheoryData<string> CaseNames()
    {
        var data = new TheoryData<string>();
        foreach (var c in All())
        {
            data.Add(c.Name);
        }

        return data;
    }

    [Fact]
    public void Corpus_HasAtLeast25Cases_WithDistinctNamesAndProblems()
    {
        var cases = All().ToList();
        Assert.True(cases.Count >= 25, $"only {cases.Count} broken files");
        Assert.Equal(cases.Count, cases.Select(c => c.Name).Distinct().Count());
        Assert.Equal(cases.Count, cases.Select(c => c.ExpectedProblem).Distinct().Count());
    }

    [Theory]
    [MemberData(nameof(CaseNames))]
    public void ThroughDetection_GivesItsOwnOneLineError(string name)
    {
        var c = All().Single(x => x.Name == name);
        using var folder = new TempFolder("broken");
        var path = folder.Write(c.FileName, c.Content);
        foreach (var (side, bytes) in c.SideFiles ?? new Dictionary<string, byte[]>())
        {
            folder.Write(side, bytes);
        }

        var before = Directory.GetFiles(folder.FullPath).Order().ToArray();
        var e = Assert.Throws<RecordingFormatException>(() => OpenAndRead(c, path));
        Assert.DoesNotContain('\n', e.Message);
        Assert.StartsWith(path + ": ", e.Message);
        Assert.True(e.Message.Contains(c.ExpectedProblem, StringComparison.Ordinal), $"message \"{e.Message}\" lacks \"{c.ExpectedProblem}\"");
        if (c.ExpectedByteOffset is long offset)
        {
            Assert.Equal(offset, e.ByteOffset);
            Assert.EndsWith($" at byte {offset}", e.Message);
        }

        // Nothing is written beside a file that is read.
        Assert.Equal(before, Directory.GetFiles(folder.FullPath).Order().ToArray());
    }

    [Fact]
    public void EveryFormat_ContributesItsShare()
    {
        var cases = All().ToList();
        foreach (var (prefix, least) in new[] { ("edf-", 12), ("wfdb-", 12), ("ishne-", 7), ("csv-", 5) })
        {
            Assert.True(cases.Count(c => c.Name.StartsWith(prefix, StringComparison.Ordinal)) >= least, prefix);
        }
    }

    [Fact]
    public void EmptyFile_IsRefusedByName()
    {
        using var folder = new TempFolder("broken");
        var path = folder.Write("empty.bin", []);
        var e = Assert.Throws<RecordingFormatException>(() => RecordingOpener.Open(path));
        Assert.Equal($"{path}: file is empty at byte 0", e.Message);
    }

    [Fact]
    public void UnknownContent_IsRefusedByName()
    {
        using var folder = new TempFolder("broken");
        var path = folder.Write("notes.bin", [0x50, 0x4B, 0x03, 0x04, 0, 0, 0, 0]);
        var e = Assert.Throws<RecordingFormatException>(() => RecordingOpener.Open(path));
        Assert.Contains("not a recording LongRecord reads", e.Message);
    }

    private static void OpenAndRead(BrokenFile c, string path)
    {
        // Cases of the WFDB corpus that name a file other than a header are annotation files, read as annotations.
        if (c.Name.StartsWith("wfdb-", StringComparison.Ordinal) && !path.EndsWith(".hea", StringComparison.Ordinal))
        {
            WfdbAnnotationReader.Read(path);
            return;
        }

        using var reader = RecordingOpener.Open(path);
        var buffer = new float[4096];
        for (var k = 0; k < reader.Info.Channels.Count; k++)
        {
            var n = reader.Info.Channels[k].SampleCount;
            for (long s = 0; s < n; s += buffer.Length)
            {
                reader.Read(k, s, buffer.AsSpan(0, (int)Math.Min(buffer.Length, n - s)));
            }
        }

        if (!reader.Info.HasSignal)
        {
            reader.Read(0, 0, buffer.AsSpan(0, 1));
        }
    }
}
