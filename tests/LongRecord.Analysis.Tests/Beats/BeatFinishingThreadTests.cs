using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Tests.Support;

namespace LongRecord.Analysis.Tests.Beats;

/// <summary>
/// The beats stage's second thread ends with its stream, whether the stream is completed or abandoned (MITDB 100,
/// its first two minutes; the reference beat count comes from its <c>atr</c> file).
/// </summary>
public sealed class BeatFinishingThreadTests
{
    private static readonly Lazy<ReferenceRecord> s_record = new(() => ReferenceRecord.Load("mitdb", "100"));

    [Fact]
    public void Completed_ThreadEnds_AndEveryBeatComesBack()
    {
        var record = s_record.Value;
        using var analyser = new BeatAnalyser(record.SamplingRateHz, record.Leads.Length, finishOnSecondThread: true);
        var samples = Feed(analyser, record, seconds: 120);
        analyser.Complete();
        Assert.True(analyser.SecondThread!.WaitEnded(TimeSpan.FromSeconds(10)));

        var reference = record.Annotations.Count(a => a.Sample < samples && a.IsBeat);
        Assert.InRange(analyser.Beats.Count, reference - 2, reference + 2);
    }

    [Fact]
    public void Abandoned_ThreadEndsOnDispose()
    {
        var record = s_record.Value;
        var analyser = new BeatAnalyser(record.SamplingRateHz, record.Leads.Length, finishOnSecondThread: true);
        Feed(analyser, record, seconds: 120);
        analyser.Dispose();
        Assert.True(analyser.SecondThread!.WaitEnded(TimeSpan.FromSeconds(10)), "the thread still waits for beats after Dispose");
    }

    private static long Feed(BeatAnalyser analyser, ReferenceRecord record, int seconds)
    {
        var block = (int)record.SamplingRateHz;
        var buffer = new float[record.Leads.Length * block];
        for (var s = 0; s < seconds; s++)
        {
            record.CopyBlock((long)s * block, block, buffer);
            analyser.Process(buffer, block);
        }

        return (long)seconds * block;
    }
}
