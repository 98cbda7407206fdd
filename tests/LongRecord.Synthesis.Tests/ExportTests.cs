using System.Security.Cryptography;
using LongRecord.Formats;
using LongRecord.Formats.Wfdb;
using LongRecord.Synthesis.Export;
using LongRecord.Synthesis.Scenarios;
using LongRecord.Synthesis.Truth;
using LongRecord.TestSupport;

namespace LongRecord.Synthesis.Tests;

/// <summary>
/// Synthesise → write EDF+ (with diary annotations), WFDB truth annotations and truth JSON → read back with the
/// project's readers. Foundation issue: "Round trip: synthesise → write EDF+ → read back gives samples equal within one
/// quantisation step and identical annotations"; "the R peaks found in the written EDF+ … sit within 10 ms of the
/// truth"; "the same seed gives the same bytes".
/// </summary>
public sealed class ExportTests
{
    [Fact]
    public void EdfPlus_ReadBack_SamplesWithinOneStep_DiaryAndTruthAnnotationsIdentical()
    {
        var scenario = ScenarioFiles.Load("sinus-with-pacs") with
        {
            Diary = [new DiaryEntry(12.5, "palpitations"), new DiaryEntry(61, "event button")],
        };
        var rec = SyntheticRecording.Create(scenario);
        using var folder = new TempFolder("export");
        var paths = SyntheticRecordingExport.Write(rec, folder.Path("rec.edf"));

        using var reader = RecordingOpener.Open(paths.Edf);
        Assert.Equal(RecordingFormat.Edf, reader.Info.Format);
        Assert.Equal(rec.Leads, reader.Info.Channels.Select(c => c.Label));
        Assert.All(reader.Info.Channels, c => Assert.Equal(rec.SamplingRateHz, c.SamplingRateHz));
        Assert.Equal(rec.SampleCount, reader.Info.Channels[0].SampleCount);
        Assert.Equal(rec.StartDateTime, reader.Info.StartDateTime);

        var n = (int)rec.SampleCount;
        var written = new float[rec.Leads.Count * n];
        rec.Render(0, n, written);
        var read = new float[n];
        for (var k = 0; k < rec.Leads.Count; k++)
        {
            reader.Read(k, 0, read);
            var step = reader.Info.Channels[k].Resolution;
            for (var i = 0; i < n; i++)
            {
                Assert.True(Math.Abs(written[k * n + i] - read[i]) <= step + 1e-6, $"lead {k} sample {i}: wrote {written[k * n + i]}, read {read[i]} (step {step})");
            }
        }

        Assert.Equal(scenario.Diary.Select(d => (d.AtS, d.Text)), reader.Info.Events.Select(e => (e.OnsetS, e.Text)));

        var expected = SyntheticRecordingExport.ToWfdb(rec.Truth.Annotations()).ToList();
        Assert.Equal(expected, WfdbAnnotationReader.Read(paths.Annotations));
        var truth = TruthDocument.Load(paths.Truth);
        Assert.Equal(rec.Truth.Beats.Count, truth.Beats.Count);
    }

    [Theory]
    [InlineData("ve-runs", 250.0)]
    [InlineData("af", 128.0)]
    [InlineData("psvt-180", 360.0)]
    public void RPeaksFoundInTheWrittenEdf_WithinTenMsOfTruth(string name, double rateHz)
    {
        var rec = ScenarioFiles.Recording(name, rateHz);
        using var folder = new TempFolder("export");
        var paths = SyntheticRecordingExport.Write(rec, folder.Path(name + ".edf"));
        using var reader = RecordingOpener.Open(paths.Edf);
        var n = (int)reader.Info.Channels[0].SampleCount;
        var leads = new float[reader.Info.Channels.Count][];
        for (var k = 0; k < leads.Length; k++)
        {
            leads[k] = new float[n];
            reader.Read(k, 0, leads[k]);
        }

        var peaks = SignalProbe.FindRPeaks(leads, rateHz);
        foreach (var beat in rec.Truth.Beats)
        {
            var p = SignalProbe.Nearest(peaks, beat.RSample);
            Assert.True(p is long q && Math.Abs(q / rateHz - beat.RTimeS) <= 0.010, $"{name} beat at {beat.RTimeS:F3} s: nearest peak {p}");
        }
    }

    [Fact]
    public void SameSeed_SameBytes_DifferentSeed_DifferentBytes()
    {
        using var folder = new TempFolder("export");
        var a = Export(folder, "a", 7);
        var b = Export(folder, "b", 7);
        var c = Export(folder, "c", 8);
        Assert.Equal(a, b);
        Assert.NotEqual(a.Edf, c.Edf);
    }

    private static (string Edf, string Atr, string Truth) Export(TempFolder folder, string name, ulong seed)
    {
        var rec = ScenarioFiles.Recording("mat", seed: seed);
        var p = SyntheticRecordingExport.Write(rec, folder.Path(name + ".edf"));
        return (Hash(p.Edf), Hash(p.Annotations), Hash(p.Truth));
    }

    private static string Hash(string path) => Convert.ToHexString(SHA256.HashData(File.ReadAllBytes(path)));
}

/// <summary>Every scenario of the catalogue exports (first minute) and reads back through format detection.</summary>
public sealed class CatalogueExportTests
{
    public static TheoryData<string> Names()
    {
        var data = new TheoryData<string>();
        foreach (var f in Directory.GetFiles(ScenarioFiles.Folder, "*.json").Order())
        {
            data.Add(Path.GetFileNameWithoutExtension(f));
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(Names))]
    public void Scenario_ExportsAndReadsBack(string name)
    {
        var rec = ScenarioFiles.Recording(name, hours: 1.0 / 60);
        using var folder = new TempFolder("catalogue");
        var paths = SyntheticRecordingExport.Write(rec, folder.Path(name + ".edf"));
        using var reader = RecordingOpener.Open(paths.Edf);
        Assert.Equal(rec.SampleCount, reader.Info.Channels[0].SampleCount);
    }
}
