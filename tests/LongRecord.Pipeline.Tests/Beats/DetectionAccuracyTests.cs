using LongRecord.Pipeline.Tests.Ec57;
using Xunit.Abstractions;

namespace LongRecord.Pipeline.Tests.Beats;

/// <summary>
/// QRS detection against the expert annotations, ANSI/AAMI EC57 beat-by-beat protocol (matching in <see cref="BeatMatch"/>).
/// Thresholds from the beats issue; anchors: Pan &amp; Tompkins 1985 Se 99.76 %, +P 99.56 %; Martínez et al. 2004
/// Se 99.80 %, +P 99.86 % (both from memory).
/// </summary>
public sealed class DetectionAccuracyTests(ITestOutputHelper output)
{
    [Fact]
    public void Mitdb_All48Records_GrossSeAndPPAtLeast99_7()
    {
        var figures = new DetectionFigures("MITDB", RecordRun.All("mitdb").Select(r => r.Match()).ToArray());
        Report("1 detection MITDB", figures);
        Assert.Equal(48, figures.Records.Count);
        Assert.True(figures.SensitivityPercent >= 99.7, figures.Line);
        Assert.True(figures.PositivePredictivityPercent >= 99.7, figures.Line);
    }

    [Fact]
    public void Svdb_RecordsPresent_GrossSeAndPPAtLeast99_5()
    {
        var figures = new DetectionFigures("SVDB", RecordRun.All("svdb").Select(r => r.Match()).ToArray());
        Report("2 detection SVDB", figures);
        Assert.True(figures.SensitivityPercent >= 99.5, figures.Line);
        Assert.True(figures.PositivePredictivityPercent >= 99.5, figures.Line);
    }

    [Fact]
    public void Nstdb_Record118_NoiseStress_24dBAt99_5_12dBAt98()
    {
        // EC57 noise stress test (Moody, Muldrow & Mark 1984): MITDB 118 with electrode-motion noise at set SNRs.
        var bySnr = new[] { ("118e24", 24), ("118e12", 12), ("118e06", 6), ("118e00", 0), ("118e_6", -6) }
            .Select(x => (Snr: x.Item2, Run: RecordRun.Get("nstdb", x.Item1)))
            .Select(x => (x.Snr, x.Run, Figures: new DetectionFigures($"NSTDB {x.Run.Record} ({x.Snr} dB)", [x.Run.Match()])))
            .ToArray();
        FiguresReport.Add("3 detection NSTDB", string.Join("\n", bySnr.Select(x => FormattableString.Invariant($"{x.Figures.Line}; unanalysable {x.Run.UnanalysablePercent:F1} % of the record"))));
        foreach (var (_, _, f) in bySnr)
        {
            output.WriteLine(f.Line);
        }

        var at24 = bySnr[0].Figures;
        Assert.True(bySnr[0].Run.UnanalysablePercent < 0.5, "no stretch of the 24 dB record should need excluding");
        var at12 = bySnr[1].Figures;
        Assert.True(at24.SensitivityPercent >= 99.5 && at24.PositivePredictivityPercent >= 99.5, at24.Line);
        Assert.True(at12.SensitivityPercent >= 98 && at12.PositivePredictivityPercent >= 98, at12.Line);
    }

    private void Report(string key, DetectionFigures figures)
    {
        var table = figures.Table();
        output.WriteLine(table);
        FiguresReport.Add(key, table);
    }
}
