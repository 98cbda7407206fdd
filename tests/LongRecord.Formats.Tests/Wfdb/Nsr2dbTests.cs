using LongRecord.Formats.Wfdb;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>Normal Sinus Rhythm RR Interval Database (PhysioNet nsr2db 1.0.0), development subset.</summary>
public class Nsr2dbTests
{
    [Fact]
    public void Headers_DeclareZeroSignals()
    {
        // Source: nsr2db README (27 records; .hea with 0 signals at 128 Hz and an age/sex comment).
        var records = WfdbReferenceChecks.RecordPaths("nsr2db").ToList();
        Assert.Equal(27, records.Count);
        foreach (var path in records)
        {
            using var reader = WfdbRecordReader.Open(path);
            Assert.Empty(reader.Info.Channels);
            Assert.False(reader.Info.HasSignal);
            Assert.Equal("header declares no signals", reader.Info.NoSignalReason);
            Assert.Equal(128.0, reader.Header.SamplingFrequencyHz);
            Assert.Equal(0, reader.Info.DurationS);
            Assert.Single(reader.Info.Comments);
            Assert.Contains("ge", reader.Info.Comments[0], StringComparison.Ordinal);
        }
    }

    [Fact]
    public void EcgBeats_MatchReadmeCount()
    {
        // Source: nsr2db README ("27 records, 2,880,764 beat annotations in .ecg").
        var beats = WfdbReferenceChecks.RecordPaths("nsr2db").Sum(p => WfdbAnnotationReader.Enumerate(p + ".ecg").Count(a => a.IsBeat));
        Assert.Equal(2880764, beats);
    }
}
