using LongRecord.Formats.Edf;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Edf;

/// <summary>Every broken file of <see cref="EdfBrokenCorpus"/> must fail with its own one-line message and byte offset.</summary>
public sealed class EdfBrokenCorpusTests
{
    private static readonly Lazy<Dictionary<string, BrokenFile>> s_cases = new(() => EdfBrokenCorpus.Build().ToDictionary(c => c.Name));

    public static TheoryData<string> Names()
    {
        var data = new TheoryData<string>();
        foreach (var name in s_cases.Value.Keys)
        {
            data.Add(name);
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(Names))]
    public void BrokenFile_FailsWithItsMessageAndOffset(string name)
    {
        var broken = s_cases.Value[name];
        using var folder = new TempFolder("edf-broken");
        var path = folder.Write(broken.FileName, broken.Content);

        var e = Assert.Throws<RecordingFormatException>(() =>
        {
            using var reader = EdfReader.Open(path);
            Assert.True(broken.FailsOnRead, "the file opened although it should not");
            foreach (var (channel, index) in reader.Info.Channels.Select((c, i) => (c, i)))
            {
                reader.Read(index, 0, new float[channel.SampleCount]);
            }
        });

        Assert.StartsWith(path + ": ", e.Message);
        Assert.DoesNotContain('\n', e.Message);
        Assert.Contains(broken.ExpectedProblem, e.Message);
        Assert.Equal(broken.ExpectedByteOffset, e.ByteOffset);
        Assert.EndsWith($" at byte {broken.ExpectedByteOffset}", e.Message);
    }

    [Fact]
    public void Corpus_HasAtLeastTwelveDistinctCasesNamedForTheDetector()
    {
        var cases = s_cases.Value.Values.ToList();
        Assert.True(cases.Count >= 12);
        Assert.All(cases, c => Assert.StartsWith("edf-", c.Name));
        Assert.Equal(cases.Count, cases.Select(c => c.ExpectedProblem).Distinct().Count());
    }

    [Fact]
    public void Corpus_EveryFileStillSniffsAsEdf()
    {
        // The format detector routes by content; each broken file must reach EdfReader to get its specific message.
        Assert.All(s_cases.Value.Values, c => Assert.True(EdfReader.Sniff(c.Content), c.Name));
    }
}
