using LongRecord.Formats;
using LongRecord.Pipeline.Batch;
using LongRecord.Pipeline.Inputs;
using LongRecord.TestSupport;

namespace LongRecord.Pipeline.Tests.Batch;

/// <summary>The index's reading of episodes.csv, the leftovers of a killed run, and failure lines without paths above the root.</summary>
public sealed class BatchIndexTests
{
    [Fact]
    public void SplitCsv_FollowsRfc4180Quoting()
    {
        // RFC 4180 §2 rules 5–7: fields may be quoted; quoted fields may hold commas; a quote inside is doubled.
        Assert.Equal(new[] { "aaa", "bbb", "ccc" }, IndexFigures.SplitCsv("\"aaa\",\"bbb\",\"ccc\""));
        Assert.Equal(new[] { "aaa", "b,bb", "ccc" }, IndexFigures.SplitCsv("aaa,\"b,bb\",ccc"));
        Assert.Equal(new[] { "aaa", "b\"bb", "ccc" }, IndexFigures.SplitCsv("\"aaa\",\"b\"\"bb\",\"ccc\""));
        Assert.Equal(new[] { "", "", "" }, IndexFigures.SplitCsv(",,"));
    }

    [Fact]
    public void EpisodeCounts_ByKind_UnknownKindsAsOther_RowsMarkedNotFlaggedLeftOut()
    {
        using var folder = new TempFolder("index-figures");
        folder.Write("episodes.csv", """
            id,kind,start_s,end_s,flagged,evidence
            1,af,10,100,1,"irregular, no P waves"
            2,pause,200,202.5,1,
            3,pause,300,302.1,0,
            4,svt-run,400,410,1,"narrow, fast"
            """u8.ToArray());
        var counts = IndexFigures.Read(folder.FullPath).EpisodesByKind;
        Assert.Equal(1, counts["af"]);
        Assert.Equal(1, counts["pause"]);
        Assert.Equal(1, counts[IndexFigures.OtherKind]);
    }

    [Fact]
    public void StaleOutputs_RemovesOnlyThisRecordingsLeftovers()
    {
        using var root = new TempFolder("stale");
        foreach (var d in new[] { ".rec.partial-1", ".rec.old-2", ".rec2.partial-3", "rec" })
        {
            Directory.CreateDirectory(root.Path(d));
        }

        Assert.Equal(2, StaleOutputs.Remove(root.FullPath, "rec"));
        Assert.Equal(new[] { ".rec2.partial-3", "rec" }, Directory.GetDirectories(root.FullPath).Select(Path.GetFileName).Order(StringComparer.Ordinal));
    }

    [Fact]
    public void FailureText_NamesFilesRelativeToTheInputRoot()
    {
        var input = new RecordingInput("/data/Surname Firstname/clinic/a/rec.hea", "a/rec.hea", "rec", "rec");
        Assert.Equal("a/rec.hea: bad gain at byte 12", FailureText.Of(new RecordingFormatException(input.Path, "bad gain", 12), input));
        Assert.Equal("a/rec.dat: file ends early", FailureText.Of(new RecordingFormatException("/data/Surname Firstname/clinic/a/rec.dat", "file ends early"), input));
        Assert.Equal("a/rec.hea: cannot be read (Could not find file 'a/rec.dat'.)",
            FailureText.OfIo(new FileNotFoundException("Could not find file '/data/Surname Firstname/clinic/a/rec.dat'."), input));
    }
}
