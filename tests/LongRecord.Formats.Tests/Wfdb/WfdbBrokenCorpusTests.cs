using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>Every case of <see cref="WfdbBrokenCorpus"/> fails with its own one-line message and byte offset.</summary>
public class WfdbBrokenCorpusTests
{
    public static TheoryData<BrokenFile> Cases() => [.. WfdbBrokenCorpus.Build()];

    [Fact]
    public void Corpus_HasDistinctNamedCases()
    {
        var cases = WfdbBrokenCorpus.Build().ToList();
        Assert.True(cases.Count >= 12, $"{cases.Count} cases");
        Assert.All(cases, c => Assert.StartsWith("wfdb-", c.Name, StringComparison.Ordinal));
        Assert.Equal(cases.Count, cases.Select(c => c.Name).Distinct().Count());
        Assert.Equal(cases.Count, cases.Select(c => c.ExpectedProblem).Distinct().Count());
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void BrokenFile_FailsWithItsMessageAndOffset(BrokenFile broken)
    {
        using var folder = new TempFolder("wfdb-broken");
        var path = folder.Write(broken.FileName, broken.Content);
        foreach (var (name, bytes) in broken.SideFiles ?? new Dictionary<string, byte[]>())
        {
            folder.Write(name, bytes);
        }

        var e = Assert.Throws<RecordingFormatException>(() => Open(path, broken.FailsOnRead));
        Assert.DoesNotContain('\n', e.Message);
        Assert.StartsWith(path + ": ", e.Message, StringComparison.Ordinal);
        Assert.Contains(broken.ExpectedProblem, e.Message, StringComparison.Ordinal);
        Assert.Equal(broken.ExpectedByteOffset, e.ByteOffset);
    }

    private static void Open(string path, bool failsOnRead)
    {
        if (!path.EndsWith(".hea", StringComparison.Ordinal))
        {
            WfdbAnnotationReader.Read(path);
            return;
        }

        using var reader = WfdbRecordReader.Open(path);
        Assert.True(failsOnRead, "the record opened but this case must fail at open");
        reader.Read(0, 0, new float[1]);
    }
}
