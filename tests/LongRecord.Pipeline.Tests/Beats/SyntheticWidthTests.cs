using System.Globalization;
using LongRecord.Formats;
using LongRecord.Pipeline.Channels;
using LongRecord.Synthesis;
using LongRecord.Synthesis.Export;
using LongRecord.Synthesis.Scenarios;
using LongRecord.TestSupport;
using Xunit.Abstractions;

namespace LongRecord.Pipeline.Tests.Beats;

/// <summary>
/// QRS width against the synthesiser's exact truth, through the product's path (EDF+ written, read, beats detected
/// and delineated). Beats issue: median absolute error ≤ 8 ms and narrow/broad agreement at 120 ms ≥ 98 %; an empty
/// width on a detected beat, or a truth beat with no detection within 150 ms, counts as an error.
/// </summary>
public sealed class SyntheticWidthTests(ITestOutputHelper output)
{
    private static readonly string[] s_scenarios =
        ["sinus-with-pacs", "ve-runs", "ventricular-bigeminy", "broad-tachycardia", "psvt-180", "af", "flutter-2to1-150", "mat"];

    [Fact]
    public void Catalogue_WidthMedianErrorAtMost8ms_NarrowBroadAgreementAtLeast98()
    {
        var (median, agreement, line) = Measure(null);
        FiguresReport.Add("9a delineation synthetic widths", line);
        Assert.True(median <= 8, line);
        Assert.True(agreement >= 98, line);
    }

    /// <summary>
    /// The same catalogue in 12 dB muscle noise over the whole recording (the noise stress test's SNR definition, as
    /// the synthesiser calibrates it). Our own floor, not the issue's (which names no noise): median |error| ≤ 10 ms
    /// and narrow/broad agreement ≥ 95 %, so that noise neither widens normal beats into broad ones nor narrows
    /// ventricular ones. Before noisy beats took their template's boundaries this measured a median |error| of 19.3 ms
    /// and 70.1 % agreement (40 % of the normal beats of sinus rhythm measured 120 ms or more).
    /// </summary>
    [Fact]
    public void Catalogue_In12dBMuscleNoise_WidthMedianErrorAtMost10ms_NarrowBroadAgreementAtLeast95()
    {
        var (median, agreement, line) = Measure(12);
        FiguresReport.Add("9b delineation synthetic widths in noise", line);
        Assert.True(median <= 10, line);
        Assert.True(agreement >= 95, line);
    }

    private (double Median, double Agreement, string Line) Measure(double? snrDb)
    {
        var errors = new List<double>();
        long agree = 0, total = 0;
        using var folder = new TempFolder("widths");
        foreach (var name in s_scenarios)
        {
            var scenario = ScenarioLoader.Load(Scenarios.Path(name));
            if (snrDb is double snr)
            {
                scenario = scenario with { Noise = [.. scenario.Noise, new NoiseStretch { Kind = NoiseKind.Muscle, StartS = 0, DurationS = scenario.TimelineDurationS, SnrDb = snr }] };
            }

            var rec = SyntheticRecording.Create(scenario);
            var paths = SyntheticRecordingExport.Write(rec, folder.Path(name + ".edf"));
            using var reader = RecordingOpener.Open(paths.Edf);
            var channels = EcgChannelSelector.Select(reader.Info);
            var beats = RecordingSummariser.DetectBeats(reader, channels, 1 << 16).Beats;
            var samples = beats.Select(b => b.Sample).ToArray();
            var tol = (long)Math.Round(0.150 * rec.SamplingRateHz);
            long missed = 0, empty = 0, disagree = 0;
            foreach (var t in rec.Truth.Beats)
            {
                var truthMs = (t.QrsOffsetS - t.QrsOnsetS) * 1000;
                var j = DelineationAccuracyTests.Nearest(samples, t.RSample);
                total++;
                if (j < 0 || Math.Abs(samples[j] - t.RSample) > tol || float.IsNaN(beats[j].QrsMs))
                {
                    errors.Add(double.PositiveInfinity);
                    missed += j < 0 || Math.Abs(samples[j] - t.RSample) > tol ? 1 : 0;
                    empty += j >= 0 && Math.Abs(samples[j] - t.RSample) <= tol ? 1 : 0;
                    continue;
                }

                errors.Add(Math.Abs(beats[j].QrsMs - truthMs));
                var same = (beats[j].QrsMs >= 120) == (truthMs >= 120);
                agree += same ? 1 : 0;
                disagree += same ? 0 : 1;
            }

            output.WriteLine(FormattableString.Invariant($"{name}: {rec.Truth.Beats.Count} truth beats, {missed} not detected, {empty} without width, {disagree} narrow/broad disagreements"));
        }

        var median = errors.Order().ElementAt(errors.Count / 2);
        var agreement = 100.0 * agree / total;
        var line = string.Create(CultureInfo.InvariantCulture,
            $"Synthetic QRS width ({total} truth beats, {s_scenarios.Length} scenarios at 250 Hz{(snrDb is double d ? $", muscle noise {d} dB" : "")}): median |error| {median:F1} ms, narrow/broad agreement {agreement:F1} %");
        output.WriteLine(line);
        return (median, agreement, line);
    }
}
