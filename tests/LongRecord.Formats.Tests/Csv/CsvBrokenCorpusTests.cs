using LongRecord.Formats.Csv;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Csv;

public class CsvBrokenCorpusTests
{
    public static TheoryData<string> CaseNames
    {
        get
        {
            var data = new TheoryData<string>();
            foreach (var c in CsvBrokenCorpus.Build())
            {
                data.Add(c.Name);
            }

            return data;
        }
    }

    [Fact]
    public void Corpus_HasUniquePrefixedNames_AndDistinctProblems()
    {
        var cases = CsvBrokenCorpus.Build().ToArray();
        Assert.True(cases.Length >= 5);
        Assert.All(cases, c => Assert.StartsWith("csv-", c.Name));
        Assert.Equal(cases.Length, cases.Select(c => c.Name).Distinct().Count());
        Assert.Equal(cases.Length, cases.Select(c => c.ExpectedProblem).Distinct().Count());
    }

    [Theory]
    [MemberData(nameof(CaseNames))]
    public void BrokenFile_IsRejectedWithOneLineMessage(string name)
    {
        var broken = CsvBrokenCorpus.Build().Single(c => c.Name == name);
        using var temp = new TempFolder("csv-broken");
        var path = temp.Write(broken.FileName, broken.Content);

        var e = Assert.Throws<RecordingFormatException>(() =>
        {
            using var reader = CsvRecordingReader.Open(path);
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
