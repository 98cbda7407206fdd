using LongRecord.Formats;
using LongRecord.Formats.Wfdb;
using LongRecord.Pipeline;
using LongRecord.Pipeline.Report;
using LongRecord.Reporting.Tests.Support;
using LongRecord.TestSupport;

namespace LongRecord.Reporting.Tests.Strips;

/// <summary>
/// Strip windows read back from a synthetic recording through the Formats readers, checked against the
/// synthesiser's exact truth (NAME.atr): the beats labelled on a strip are the true beats, and each has its QRS on the
/// strip where the truth puts it.
/// </summary>
public sealed class RecordingStripSourceTests
{
    // EC57's beat-match window, 150 ms (ANSI/AAMI EC57:2012, from memory).
    private const double MatchS = 0.150;

    [Fact]
    public void Window_LabelsTheTrueBeats_AndShowsTheirQrsWhereTheTruthPutsThem()
    {
        using var folder = new TempFolder("strips");
        var edf = folder.Path("sinus.edf");
        CommandLine.Check("synth", "sinus-with-pacs", "--out", edf, "--hours", "0.05");
        var analysis = RecordingSummariser.Analyse(edf);
        var truth = WfdbAnnotationReader.Read(folder.Path("sinus.atr")).Where(a => a.IsBeat).ToArray();
        using var strips = ReportOutputs.OpenStrips(edf, analysis)!;
        var rate = analysis.ReferenceRateHz;

        var signal = strips.Read(60, 7.2);
        Assert.Equal(60, signal.StartS, 6);
        Assert.Equal((int)Math.Round(7.2 * rate), signal.Count);
        Assert.Equal(2, signal.Leads);
        var inWindow = truth.Where(t => t.Sample / rate >= 60 + MatchS && t.Sample / rate < 67.2 - MatchS).ToArray();
        Assert.True(inWindow.Length >= 5, "the scenario has beats in the window");
        foreach (var t in inWindow)
        {
            var s = t.Sample / rate;
            Assert.Contains(signal.Beats, b => Math.Abs(b.TimeS - s) <= MatchS);
            // The largest deflection within the match window of a true beat stands well above the baseline (0.3 mV:
            // a QRS of the synthetic scenario; baseline noise is far below it).
            var from = (int)((s - MatchS - 60) * rate);
            var to = (int)((s + MatchS - 60) * rate);
            var lead = signal.Lead(0)[Math.Max(0, from)..Math.Min(signal.Count, to)].ToArray();
            Assert.True(lead.Max(Math.Abs) > 0.3f, $"no QRS on the strip near the true beat at {s:0.000} s");
        }

        Assert.All(signal.Beats, b => Assert.InRange(b.TimeS, 60, 67.2));
    }

    [Fact]
    public void WindowPastTheEnd_IsClippedToTheRecording()
    {
        using var folder = new TempFolder("strips");
        var edf = folder.Path("short.edf");
        CommandLine.Check("synth", "sinus-rest", "--out", edf, "--hours", "0.01");
        var analysis = RecordingSummariser.Analyse(edf);
        using var strips = ReportOutputs.OpenStrips(edf, analysis)!;
        using var reader = RecordingOpener.Open(edf);
        var signal = strips.Read(reader.Info.DurationS - 2, 7);
        Assert.Equal((int)Math.Round(2 * analysis.ReferenceRateHz), signal.Count);
    }
}
