namespace LongRecord.Synthesis.Tests;

/// <summary>
/// Noise stretches measured on the rendered signal. The noise is rendered(Ecg + stretches) − rendered(Ecg); the SNR
/// formula is the one documented in <c>NoiseCalibration</c> after the MIT-BIH noise stress test (Moody, Muldrow and
/// Mark 1984, from memory): S = (median clean QRS peak-to-peak amplitude)² / 8 with the peak-to-peak measured here on
/// the clean render between the truth QRS onset and offset, N = mean square of the noise. Tolerance ±1 dB (issue).
/// </summary>
public sealed class NoiseTests
{
    [Fact]
    public void NoiseStretches_MatchScriptedSnrWithinOneDecibel()
    {
        var rec = ScenarioFiles.Recording("noise-motion");
        var n = (int)rec.SampleCount;
        var clean = SignalProbe.Render(rec, 0, n, SignalComponents.Ecg);
        var noisy = SignalProbe.Render(rec, 0, n, SignalComponents.Ecg | SignalComponents.NoiseStretches);
        Assert.Equal(3, rec.Truth.Noise.Count);
        foreach (var stretch in rec.Truth.Noise)
        {
            for (var k = 0; k < rec.Leads.Count; k++)
            {
                var affected = stretch.Leads.Contains(rec.Leads[k]);
                var power = 0.0;
                for (var i = stretch.StartSample; i < stretch.EndSample; i++)
                {
                    var d = noisy[k][i] - clean[k][i];
                    power += d * d;
                }

                power /= stretch.EndSample - stretch.StartSample;
                if (!affected)
                {
                    Assert.Equal(0.0, power);
                    continue;
                }

                var pp = rec.Truth.Beats.Where(b => b.RTimeS >= stretch.StartS && b.RTimeS < stretch.EndS).Select(b =>
                {
                    var seg = clean[k].AsSpan((int)b.QrsOnsetSample, (int)(b.QrsOffsetSample - b.QrsOnsetSample + 1));
                    float max = float.MinValue, min = float.MaxValue;
                    foreach (var v in seg)
                    {
                        max = Math.Max(max, v);
                        min = Math.Min(min, v);
                    }

                    return (double)(max - min);
                });
                var median = SignalProbe.Median(pp);
                var snr = 10 * Math.Log10(median * median / 8 / power);
                Assert.True(Math.Abs(snr - stretch.SnrDb!.Value) <= 1.0, $"{stretch.Kind} on {rec.Leads[k]}: measured {snr:0.00} dB, scripted {stretch.SnrDb} dB");
            }
        }
    }

    [Fact]
    public void ElectrodeMotion_HasLowFrequencyPowerAndSharpTransients()
    {
        // "Like the MIT-BIH em record": most power below 5 Hz, yet QRS-like transients (slopes comparable with a QRS).
        var rec = ScenarioFiles.Recording("noise-motion");
        var em = rec.Truth.Noise.Single(s => s.Kind == "electrode-motion");
        var count = (int)(em.EndSample - em.StartSample);
        var clean = SignalProbe.Render(rec, em.StartSample, count, SignalComponents.Ecg)[0];
        var noisy = SignalProbe.Render(rec, em.StartSample, count, SignalComponents.Ecg | SignalComponents.NoiseStretches)[0];
        var noise = noisy.Select((v, i) => (double)(v - clean[i])).ToArray();
        var samples = noise.Select((v, i) => (T: i / rec.SamplingRateHz, X: v)).ToList();
        var chunks = samples.Chunk((int)(4 * rec.SamplingRateHz)).Select(c => c.ToList()).ToList();
        double Band(double lo, double hi) => Enumerable.Range(0, (int)((hi - lo) / 0.25)).Sum(j => chunks.Average(c => SignalProbe.Power(c, lo + 0.25 * j)));
        Assert.True(Band(0.25, 5) > 3 * Band(5, 40), "electrode motion should be mostly low-frequency");
        var maxNoiseSlope = noise.Zip(noise.Skip(1), (a, b) => Math.Abs(b - a)).Max();
        var maxQrsSlope = clean.Zip(clean.Skip(1), (a, b) => Math.Abs(b - a)).Max();
        Assert.True(maxNoiseSlope > 0.3 * maxQrsSlope, $"steepest noise step {maxNoiseSlope:0.000} mV vs QRS {maxQrsSlope:0.000} mV per sample");
    }

    [Fact]
    public void LeadOff_FlatOrAtTheRailOnTheScriptedLeadsOnly()
    {
        var rec = ScenarioFiles.Recording("lead-off");
        var signal = SignalProbe.Render(rec, 0, (int)rec.SampleCount);
        foreach (var stretch in rec.Truth.Noise)
        {
            var expected = stretch.LeadOffMode switch { "rail-high" => 5.0f, "rail-low" => -5.0f, _ => 0f };
            for (var k = 0; k < rec.Leads.Count; k++)
            {
                var lane = signal[k].AsSpan((int)stretch.StartSample, (int)(stretch.EndSample - stretch.StartSample));
                if (stretch.Leads.Contains(rec.Leads[k]))
                {
                    Assert.True(lane.IndexOfAnyExcept(expected) < 0, $"{rec.Leads[k]} not held at {expected} mV in {stretch.StartS}…{stretch.EndS} s");
                }
                else
                {
                    Assert.True(lane.ToArray().Distinct().Count() > 100, $"{rec.Leads[k]} should carry signal");
                }
            }
        }
    }
}
