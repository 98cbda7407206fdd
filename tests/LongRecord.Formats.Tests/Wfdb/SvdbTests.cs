using LongRecord.Formats.Wfdb;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>MIT-BIH Supraventricular Arrhythmia Database (PhysioNet svdb 1.0.0), development subset.</summary>
public class SvdbTests
{
    [Fact]
    public void AllRecords_ReadFully_SamplesMatchHeaderChecksums()
    {
        // Source: svdb README (39 records here; 128 Hz, 2 signals, format 212, 230400 samples each).
        var records = WfdbReferenceChecks.RecordPaths("svdb").ToList();
        Assert.Equal(39, records.Count);
        foreach (var path in records)
        {
            using var reader = WfdbRecordReader.Open(path);
            Assert.All(reader.Info.Channels, c => Assert.Equal((128.0, 230400L), (c.SamplingRateHz, c.SampleCount)));
            WfdbReferenceChecks.AssertSamplesMatchHeaderChecksums(reader);
        }
    }

    [Fact]
    public void BeatAnnotations_MatchReadmeCount()
    {
        // Source: svdb README ("39 records, 91,575 beat annotations in their .atr files").
        var beats = WfdbReferenceChecks.RecordPaths("svdb").Sum(p => WfdbAnnotationReader.Enumerate(p + ".atr").Count(a => a.IsBeat));
        Assert.Equal(91575, beats);
    }
}
