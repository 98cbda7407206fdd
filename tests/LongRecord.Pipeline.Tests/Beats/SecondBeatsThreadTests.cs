using LongRecord.Analysis.Beats;
using LongRecord.Formats;
using LongRecord.Pipeline.Channels;
using LongRecord.Pipeline.Inputs;
using LongRecord.TestSupport;

namespace LongRecord.Pipeline.Tests.Beats;

/// <summary>
/// The beats stage's second thread (delineation and classification overlapping detection) changes the speed only:
/// the beats, their classes and the quality stretches are the same as when one thread does everything, on detected
/// beats and on beats re-analysed from a reviewed annotation file (MITDB 208: frequent V and F beats; SVDB 800).
/// </summary>
public sealed class SecondBeatsThreadTests
{
    [Theory]
    [InlineData("mitdb", "208", null)]
    [InlineData("svdb", "800", null)]
    [InlineData("mitdb", "208", "atr")]
    public void SecondThread_GivesTheSameBeatsAsOne(string database, string record, string? annotator)
    {
        var path = Path.Combine(SharedData.Physionet(database), record + ".hea");
        var one = Analyse(path, annotator, secondThread: false);
        var two = Analyse(path, annotator, secondThread: true);

        Assert.True(one.Beats.Count > 1000, $"{database} {record}: only {one.Beats.Count} beats");
        Assert.Equal(one.Beats.Count, two.Beats.Count);
        for (var i = 0; i < one.Beats.Count; i++)
        {
            Assert.True(one.Beats[i].Equals(two.Beats[i]), $"beat {i} differs: {one.Beats[i].Sample} {one.Beats[i].Class} vs {two.Beats[i].Sample} {two.Beats[i].Class}");
        }

        Assert.Equal(one.Quality, two.Quality);
        Assert.Equal(one.DroppedUnanalysable, two.DroppedUnanalysable);
    }

    private static BeatAnalyser Analyse(string path, string? annotator, bool secondThread)
    {
        using var reader = RecordingOpener.Open(path);
        var channels = EcgChannelSelector.Select(reader.Info);
        var given = annotator is null ? null : ExternalBeats.Load(annotator, reader.Info.FilePath, channels.ReferenceRateHz);
        return RecordingSummariser.DetectBeats(reader, channels, 1 << 16, given: given, secondThread: secondThread);
    }
}
