using LongRecord.Synthesis.Truth;

namespace LongRecord.Synthesis.Tests;

/// <summary>Atrial activity measured on the rendered signal between and before the QRS–T complexes.</summary>
public sealed class AtrialActivityTests
{
    /// <summary>
    /// Flutter waves: a DFT over the rendered ECG1 samples that lie between one beat's T end + 20 ms and the next beat's
    /// QRS onset − 20 ms (each window's mean removed), evaluated 3–12 Hz in 0.02 Hz steps on the kept samples of each
    /// 10 s of recording and averaged over those stretches (Bartlett's method over gapped data, so the lines are 0.1 Hz
    /// wide and the grid cannot miss them). Criteria from the issue: the peak lies at the scripted atrial rate ± 5 %
    /// with at least 3× the band's median power.
    /// </summary>
    [Theory]
    [InlineData("flutter-4to1-75")]
    [InlineData("flutter-variable")]
    public void FlutterGaps_SpectrumPeaksAtAtrialRate(string scenario)
    {
        var rec = ScenarioFiles.Recording(scenario);
        var flutter = SignalProbe.Segment(rec, "atrial-flutter");
        var atrialHz = flutter.Parameters["atrialRateBpm"] / 60.0;
        var ecg1 = SignalProbe.Render(rec, 0, (int)rec.SampleCount)[0];
        var fs = rec.SamplingRateHz;
        var beats = rec.Truth.Beats.Where(b => b.RTimeS >= flutter.StartS && b.RTimeS <= flutter.EndS).ToList();
        var kept = new List<(double T, double X)>();
        for (var i = 0; i + 1 < beats.Count; i++)
        {
            var from = (long)Math.Ceiling((beats[i].TEndS + 0.02) * fs);
            var to = (long)Math.Floor((beats[i + 1].QrsOnsetS - 0.02) * fs);
            if (to - from < 0.05 * fs)
            {
                continue;
            }

            var mean = 0.0;
            for (var n = from; n <= to; n++)
            {
                mean += ecg1[n];
            }

            mean /= to - from + 1;
            for (var n = from; n <= to; n++)
            {
                kept.Add((n / fs, ecg1[n] - mean));
            }
        }

        var frequencies = Enumerable.Range(0, 451).Select(k => 3.0 + 0.02 * k).ToArray();
        var chunks = kept.GroupBy(s => (int)(s.T / 10.0)).Select(g => g.ToList()).ToList();
        var spectrum = frequencies.Select(f => (F: f, P: chunks.Average(c => SignalProbe.Power(c, f)))).ToList();
        var peak = spectrum.MaxBy(s => s.P);
        var median = SignalProbe.Median(spectrum.Select(s => s.P));
        Assert.True(kept.Count > 20 * fs, $"only {kept.Count / fs:0.0} s of flutter-wave windows");
        Assert.InRange(peak.F, atrialHz * 0.95, atrialHz * 1.05);
        Assert.True(peak.P >= 3 * median, $"peak {peak.P:0.0} vs median {median:0.0}");
    }

    /// <summary>
    /// Conduction: measured RR (R peaks found on the signal) divided by the scripted flutter cycle. 2:1 — every RR equals
    /// two cycles within 6 ms (two peaks' sample quantisation at 250 Hz, ±2 ms each, plus 2 ms; our tolerance); variable
    /// conduction — RRs are whole multiples within the same tolerance and at least two multiples occur.
    /// </summary>
    [Theory]
    [InlineData("flutter-2to1-150", 1)]
    [InlineData("flutter-variable", 2)]
    public void FlutterRr_WholeMultiplesOfFlutterCycle(string scenario, int minDistinctMultiples)
    {
        var rec = ScenarioFiles.Recording(scenario);
        var flutter = SignalProbe.Segment(rec, "atrial-flutter");
        var cycle = flutter.Parameters["flutterCycleS"];
        var peaks = SignalProbe.FindRPeaks(SignalProbe.Render(rec, 0, (int)rec.SampleCount), rec.SamplingRateHz)
            .Select(p => p / rec.SamplingRateHz).Where(t => t >= flutter.StartS - 0.005 && t <= flutter.EndS + 0.005).ToList();
        var multiples = new HashSet<int>();
        for (var i = 1; i < peaks.Count; i++)
        {
            var rr = peaks[i] - peaks[i - 1];
            var m = (int)Math.Round(rr / cycle);
            Assert.True(Math.Abs(rr - m * cycle) <= 0.006, $"RR {rr:0.0000} s is not a whole number of {cycle:0.0000} s cycles");
            multiples.Add(m);
        }

        if (minDistinctMultiples == 1)
        {
            Assert.Equal([2], multiples);
        }
        else
        {
            Assert.True(multiples.Count >= minDistinctMultiples, $"multiples seen: {string.Join(",", multiples)}");
        }
    }

    /// <summary>
    /// P waves: baseline-corrected energy (variance) of clean ECG1 in the window from max(QRS onset − 240 ms, previous
    /// beat's T end) to the QRS onset, averaged over beats. Criterion from the issue: sinus at least 4× PSVT and AF.
    /// The window is cut at the previous T end because at PSVT rates the T wave fills the classic PR window.
    /// </summary>
    [Theory]
    [InlineData("psvt-180", "psvt")]
    [InlineData("af", "af")]
    public void PrWindowEnergy_SinusAtLeastFourTimesPsvtAndAf(string scenario, string rhythm)
    {
        var rec = ScenarioFiles.Recording(scenario);
        var ecg1 = SignalProbe.Render(rec, 0, (int)rec.SampleCount, SignalComponents.Ecg)[0];
        double MeanEnergy(RhythmInterval interval, bool skipFirst)
        {
            var energies = new List<double>();
            var beats = rec.Truth.Beats;
            foreach (var b in beats.Where(b => b.Index > 0 && b.RTimeS > interval.StartS && b.RTimeS <= interval.EndS).Skip(skipFirst ? 1 : 0))
            {
                var from = (long)Math.Ceiling(Math.Max(b.QrsOnsetS - 0.24, beats[b.Index - 1].TEndS) * rec.SamplingRateHz);
                var to = b.QrsOnsetSample;
                if (to - from < 3)
                {
                    continue;
                }

                var window = ecg1.AsSpan((int)from, (int)(to - from)).ToArray();
                var mean = window.Average();
                energies.Add(window.Average(v => (v - mean) * (v - mean)));
            }

            Assert.True(energies.Count > 10, $"{interval.Kind}: {energies.Count} windows");
            return energies.Average();
        }

        var sinus = rec.Truth.Rhythms.Where(r => r.Kind == "sinus" && !r.IsEpisode).Average(r => MeanEnergy(r, false));
        var other = MeanEnergy(SignalProbe.Segment(rec, rhythm), skipFirst: true);
        Assert.True(sinus >= 4 * other, $"sinus {sinus * 1e3:0.000} vs {rhythm} {other * 1e3:0.000} (µV²×1000)");
    }

    /// <summary>Focal atrial tachycardia: every beat's P is the scripted ectopic shape and the rate rises over the warm-up (issue criteria).</summary>
    [Fact]
    public void FocalAtrialTachycardia_WarmsUpWithEctopicP()
    {
        var rec = ScenarioFiles.Recording("focal-atrial-tachycardia");
        var fat = SignalProbe.Segment(rec, "focal-atrial-tachycardia");
        var beats = rec.Truth.Beats.Where(b => b.RTimeS >= fat.StartS && b.RTimeS <= fat.EndS).ToList();
        Assert.All(beats, b => Assert.Equal("inverted", b.PShape));
        var rr = beats.Zip(beats.Skip(1), (a, b) => b.RTimeS - a.RTimeS).ToList();
        Assert.True(rr[0] > rr[^1] * 1.15, $"first RR {rr[0]:0.000} s, last {rr[^1]:0.000} s");
        Assert.InRange(60.0 / rr.Skip(10).Average(), 165 * 0.97, 165 * 1.03);

        // Inverted in the II-like lead: the clean signal at each P peak lies below the level 100 ms before it.
        var ecg1 = SignalProbe.Render(rec, 0, (int)rec.SampleCount, SignalComponents.Ecg)[0];
        var inverted = beats.Count(b => ecg1[b.PPeakSample!.Value] < ecg1[b.PPeakSample!.Value - (int)(0.03 * rec.SamplingRateHz)]);
        Assert.True(inverted >= 0.9 * beats.Count, $"{inverted} of {beats.Count} P waves dip");
    }
}
