using LongRecord.Formats.Wfdb;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>
/// Long Term AF Database (PhysioNet ltafdb 1.0.0), development subset: headers and annotations only, no signal files.
/// The annotation files are large (8.5 M annotations), so they are parsed once for all checks.
/// </summary>
public class LtafdbTests : IClassFixture<LtafdbTests.Counts>
{
    private readonly Counts _counts;

    public LtafdbTests(Counts counts) => _counts = counts;

    [Fact]
    public void Headers_ParseAsMetadataWithoutSignal()
    {
        // Source: ltafdb README (42 records; .hea + .atr + .qrs, 128 Hz, 2 channels, format 16, no .dat).
        var records = WfdbReferenceChecks.RecordPaths("ltafdb").ToList();
        Assert.Equal(42, records.Count);
        foreach (var path in records)
        {
            using var reader = WfdbRecordReader.Open(path);
            var info = reader.Info;
            Assert.False(info.HasSignal);
            Assert.Equal($"no signal file ({Path.GetFileName(path)}.dat)", info.NoSignalReason);
            Assert.Equal("WFDB (format 16)", info.FormatDetail);
            Assert.Equal(2, info.Channels.Count);
            Assert.All(info.Channels, c => Assert.Equal(128.0, c.SamplingRateHz));
            Assert.Equal(reader.Header.SamplesPerSignal!.Value / 128.0, info.DurationS);
            Assert.NotNull(info.StartTime);
            Assert.NotNull(info.StartDate);
        }
    }

    [Fact]
    public void Record00_HeaderFieldsAsWritten()
    {
        // Source: ltafdb/00.hea: "00 2 128 9661440  9:30:00 31/01/2003", gains 166.945/mV and 173.01/mV.
        using var reader = WfdbRecordReader.Open(Path.Combine(LongRecord.TestSupport.SharedData.Physionet("ltafdb"), "00.hea"));
        Assert.Equal(new DateOnly(2003, 1, 31), reader.Info.StartDate);
        Assert.Equal(new TimeOnly(9, 30, 0), reader.Info.StartTime);
        Assert.Equal(9661440 / 128.0, reader.Info.DurationS);
        Assert.Equal([166.945, 173.01], reader.Info.Channels.Select(c => c.Gain));
        Assert.All(reader.Info.Channels, c => Assert.Equal("mV", c.PhysicalUnit));
    }

    [Fact]
    public void ReadingSamples_FailsWithNoSignalFile()
    {
        using var reader = WfdbRecordReader.Open(Path.Combine(LongRecord.TestSupport.SharedData.Physionet("ltafdb"), "00"));
        var e = Assert.Throws<RecordingFormatException>(() => reader.Read(0, 0, new float[10]));
        Assert.Contains("no signal file", e.Message, StringComparison.Ordinal);
        Assert.StartsWith(reader.Info.FilePath, e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void AtrBeats_MatchReadmeCount() =>
        // Source: ltafdb README ("4,335,956 beat annotations in .atr").
        Assert.Equal(4335956, _counts.AtrBeats);

    [Fact]
    public void QrsBeats_MatchReadmeCount() =>
        // Source: ltafdb README ("4,165,395 in .qrs").
        Assert.Equal(4165395, _counts.QrsBeats);

    [Fact]
    public void Atr_CarriesAtrialFibrillationRhythmText() =>
        // Source: ltafdb README (rhythm labels include AFIB, SVTA, VT).
        Assert.Superset(new HashSet<string> { "(AFIB", "(SVTA", "(VT", "(N" }, _counts.Rhythms);

    /// <summary>One pass over every .atr and .qrs file of the folder.</summary>
    public sealed class Counts
    {
        public Counts()
        {
            foreach (var path in WfdbReferenceChecks.RecordPaths("ltafdb"))
            {
                foreach (var a in WfdbAnnotationReader.Enumerate(path + ".atr"))
                {
                    AtrBeats += a.IsBeat ? 1 : 0;
                    if (a.RhythmText is string r)
                    {
                        Rhythms.Add(r);
                    }
                }

                QrsBeats += WfdbAnnotationReader.Enumerate(path + ".qrs").Count(a => a.IsBeat);
            }
        }

        public long AtrBeats { get; }

        public long QrsBeats { get; }

        public HashSet<string> Rhythms { get; } = [];
    }
}
