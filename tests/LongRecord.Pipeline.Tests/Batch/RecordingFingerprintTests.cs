using System.Reflection;
using System.Text;
using LongRecord.Analysis.Settings;
using LongRecord.Pipeline.Batch;
using LongRecord.Pipeline.Inputs;
using LongRecord.TestSupport;

namespace LongRecord.Pipeline.Tests.Batch;

/// <summary>
/// What the fingerprint covers (batch issue, "Resumable"): input content and side files, the analysis settings, every
/// output-affecting option and the tool version; nothing else.
/// </summary>
public sealed class RecordingFingerprintTests : IDisposable
{
    private readonly TempFolder _folder = new("fingerprint");
    private readonly RecordingInput _record;

    public RecordingFingerprintTests()
    {
        // A WFDB record written by hand after WFDB header(5) and signal(5): one signal, format 16, 250 Hz, 1 000 samples.
        _folder.Write("rec.hea", Encoding.ASCII.GetBytes("rec 1 250 1000\nrec.dat 16 200 16 0 0 0 0 MLII\n"));
        _folder.Write("rec.dat", new byte[2000]);
        _folder.Write("rec.atr", [0, 0]);
        _folder.Write("other.dat", new byte[10]);
        _record = RecordingDiscovery.Find([_folder.Path("rec.hea")]).Single();
    }

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void SameInputsAndOptions_SameDigest_AndAWrittenFingerprintReadsBackEqual()
    {
        var a = RecordingFingerprint.Compute(_record, new SummaryOptions());
        var b = RecordingFingerprint.Compute(_record, new SummaryOptions());
        Assert.Equal(a.Digest, b.Digest);
        a.Write(_folder.FullPath);
        Assert.Null(a.DifferenceFrom(RecordingFingerprint.Read(_folder.FullPath)));
    }

    [Theory]
    [InlineData("rec.hea")]
    [InlineData("rec.dat")]
    [InlineData("rec.atr")]
    public void AByteOfTheHeaderSignalOrAnnotationFileChanges_InputContentChanged(string file)
    {
        var before = RecordingFingerprint.Compute(_record, new SummaryOptions());
        var bytes = File.ReadAllBytes(_folder.Path(file));
        bytes[^1] ^= file == "rec.hea" ? (byte)0 : (byte)1;
        if (file == "rec.hea")
        {
            bytes = [.. bytes, (byte)'\n'];
        }

        File.WriteAllBytes(_folder.Path(file), bytes);
        Assert.Equal("input content changed", RecordingFingerprint.Compute(_record, new SummaryOptions()).DifferenceFrom(before));
    }

    [Fact]
    public void AFileOfAnotherRecordingChanges_Unchanged()
    {
        var before = RecordingFingerprint.Compute(_record, new SummaryOptions());
        File.WriteAllBytes(_folder.Path("other.dat"), new byte[11]);
        Assert.Null(RecordingFingerprint.Compute(_record, new SummaryOptions()).DifferenceFrom(before));
    }

    [Fact]
    public void SettingsOptionsAndToolVersion_EachChangeTheFingerprint()
    {
        var before = RecordingFingerprint.Compute(_record, new SummaryOptions());
        var stricter = AnalysisSettings.Load("""{ "pauses": { "reportS": 1.5 } }""");
        Assert.Equal("settings changed", RecordingFingerprint.Compute(_record, new SummaryOptions { Settings = stricter }).DifferenceFrom(before));
        // The documented defaults given explicitly are the same settings as none given.
        Assert.Null(RecordingFingerprint.Compute(_record, new SummaryOptions { Settings = AnalysisSettings.Default }).DifferenceFrom(before));
        Assert.Equal("options changed", RecordingFingerprint.Compute(_record, new SummaryOptions { Beats = "atr" }).DifferenceFrom(before));
        Assert.Equal("tool version changed", RecordingFingerprint.Compute(_record, new SummaryOptions(), "0.0.0+other").DifferenceFrom(before));
    }

    [Fact]
    public void BlockSize_DoesNotChangeTheFingerprint()
    {
        // Results do not depend on the block size (BlockSizeInvarianceTests prove it), so it must not force a re-run.
        var before = RecordingFingerprint.Compute(_record, new SummaryOptions());
        Assert.Null(RecordingFingerprint.Compute(_record, new SummaryOptions { BlockSamples = 777 }).DifferenceFrom(before));
    }

    [Fact]
    public void AFileNamedByAnOption_ItsContentCounts()
    {
        var times = _folder.Write("beats/times.csv", "time_s\n1.0\n2.0\n"u8.ToArray());
        var options = new SummaryOptions { Beats = times };
        var before = RecordingFingerprint.Compute(_record, options);
        File.WriteAllText(times, "time_s\n1.0\n2.5\n");
        Assert.Equal("input content changed", RecordingFingerprint.Compute(_record, options).DifferenceFrom(before));
    }

    [Fact]
    public void EveryOptionOfSummaryOptions_IsInTheFingerprint_ButSettingsApartAndBlockSizeAndThreads()
    {
        // Options added later by other stages (diary, template, de-identification…) are covered without a change. The
        // block size and the beats stage's second thread are proven not to change outputs (BlockSizeInvarianceTests,
        // SecondBeatsThreadTests).
        var json = RecordingFingerprint.OptionsJson(new SummaryOptions());
        var expected = typeof(SummaryOptions).GetProperties(BindingFlags.Public | BindingFlags.Instance)
            .Select(p => p.Name)
            .Where(n => n is not nameof(SummaryOptions.Settings) and not nameof(SummaryOptions.BlockSamples) and not nameof(SummaryOptions.SecondBeatsThread))
            .Order();
        Assert.Equal(expected, json.Select(p => p.Key).Order());
    }

    [Fact]
    public void AnEditedFingerprintFile_CountsAsNone()
    {
        RecordingFingerprint.Compute(_record, new SummaryOptions()).Write(_folder.FullPath);
        var path = _folder.Path(RecordingFingerprint.FileName);
        File.WriteAllText(path, File.ReadAllText(path).Replace("\"Beats\": null", "\"Beats\": \"qrs\""));
        Assert.Null(RecordingFingerprint.Read(_folder.FullPath));
        File.WriteAllText(path, "not json");
        Assert.Null(RecordingFingerprint.Read(_folder.FullPath));
    }
}
