using LongRecord.Formats.Wfdb;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>QT Database (PhysioNet qtdb 1.0.0), development subset.</summary>
public class QtdbTests
{
    [Fact]
    public void AllRecords_ReadFully_SamplesMatchHeaderChecksums()
    {
        // Source: qtdb README (53 records; 250 Hz, 2 signals, format 212; header checksums verified against the .dat).
        var records = WfdbReferenceChecks.RecordPaths("qtdb").ToList();
        Assert.Equal(53, records.Count);
        foreach (var path in records)
        {
            using var reader = WfdbRecordReader.Open(path);
            Assert.Equal(250.0, reader.Info.Channels[0].SamplingRateHz);
            Assert.Contains(reader.Info.Channels[0].SampleCount, new long[] { 225000, 224999, 224993 });
            WfdbReferenceChecks.AssertSamplesMatchHeaderChecksums(reader);
        }
    }

    [Fact]
    public void Sel100_CounterFrequencyAndBaselineAsWritten()
    {
        // Source: qtdb/sel100.hea: "sel100 2 250/360 225000", signals "212 200(0) 11 1024".
        using var reader = WfdbRecordReader.Open(Path.Combine(LongRecord.TestSupport.SharedData.Physionet("qtdb"), "sel100"));
        Assert.Equal(250.0, reader.Header.SamplingFrequencyHz);
        Assert.Equal(360.0, reader.Header.CounterFrequencyHz);
        Assert.All(reader.Header.Signals, s => Assert.Equal((0, 1024, 0), (s.Baseline!.Value, s.AdcZero, s.EffectiveBaseline)));
    }

    [Fact]
    public void Q1c_AnnotatedBeatsAndWaveformBoundaries()
    {
        // Source: qtdb README (".q1c on all 53 (1,719 annotated beats)"; P and T peaks with "(" onset and ")" offset marks).
        var beats = 0;
        var all = new HashSet<string>();
        foreach (var path in WfdbReferenceChecks.RecordPaths("qtdb"))
        {
            var q1c = WfdbAnnotationReader.Read(path + ".q1c");
            beats += q1c.Count(a => a.IsBeat);
            var mnemonics = q1c.Select(a => a.Mnemonic).ToHashSet();
            Assert.Superset(new HashSet<string> { "(", ")" }, mnemonics);
            all.UnionWith(mnemonics);
        }

        Assert.Equal(1719, beats);
        Assert.Superset(new HashSet<string> { "(", ")", "p", "t" }, all);
    }

    [Fact]
    public void OtherAnnotationFiles_Parse()
    {
        // Source: qtdb README (.man on 53, .atr on 40, .q2c on 6 of these records), each ending in its EOF marker.
        var counts = new Dictionary<string, int> { ["man"] = 0, ["atr"] = 0, ["q2c"] = 0 };
        foreach (var path in WfdbReferenceChecks.RecordPaths("qtdb"))
        {
            foreach (var ext in counts.Keys.ToList())
            {
                if (File.Exists($"{path}.{ext}"))
                {
                    Assert.NotEmpty(WfdbAnnotationReader.Read($"{path}.{ext}"));
                    counts[ext]++;
                }
            }
        }

        Assert.Equal((53, 40, 6), (counts["man"], counts["atr"], counts["q2c"]));
    }
}
