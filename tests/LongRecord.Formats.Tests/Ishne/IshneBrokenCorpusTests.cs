using LongRecord.Formats.Ishne;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Ishne;

public class IshneBrokenCorpusTests
{
    public static TheoryData<string> CaseNames
    {
        get
        {
            var data = new TheoryData<string>();
            foreach (var c in IshneBrokenCorpus.Build())
            {
                data.Add(c.Name);
            }

            return data;
        }
    }

    [Fact]
    public void Corpus_HasUniquePrefixedNames_AndDistinctProblems()
    {
        var cases = IshneBrokenCorpus.Build().ToArray();
        Assert.True(cases.Length >= 7);
        Assert.All(cases, c => Assert.StartsWith("ishne-", c.Name));
        Assert.Equal(cases.Length, cases.Select(c => c.Name).Distinct().Count());
        Assert.Equal(cases.Length, cases.Select(c => c.ExpectedProblem).Distinct().Count());
    }

    [Theory]
    [MemberData(nameof(CaseNames))]
    public void BrokenFile_IsRejectedWithOneLineMessage(string name)
    {
        var broken = IshneBrokenCorpus.Build().Single(c => c.Name == name);
        using var temp = new TempFolder("ishne-broken");
        var path = temp.Write(broken.FileName, broken.Content);

        var e = Assert.Throws<RecordingFormatException>(() =>
        {
            using var reader = IshneReader.Open(path);
            var buffer = new float[reader.Info.Channels[0].SampleCount];
            reader.Read(0, 0, buffer);
        });

        Assert.StartsWith(path + ": ", e.Message);
        Assert.DoesNotContain('\n', e.Message);
        Assert.Contains(broken.ExpectedProblem, e.Message);
        Assert.Equal(broken.ExpectedByteOffset, e.ByteOffset);
        if (broken.ExpectedByteOffset is long offset)
        {
            Assert.EndsWith($" at byte {offset}", e.Message);
        }

        Assert.Equal([path], Directory.GetFiles(temp.FullPath));
    }
}
