using LongRecord.Analysis.Quality;
using Xunit.Abstractions;

namespace LongRecord.Analysis.Tests.Quality;

/// <summary>Noise flags against the synthesiser's noise truth, window by window (<see cref="SyntheticNoiseTruth"/>).</summary>
public sealed class SyntheticNoiseTests(ITestOutputHelper output)
{
    // Electrode-motion stretches at 6 dB and below: noise-motion.json (6 dB, both leads) and demo-24h.json (6 dB on
    // both leads from 5100 s, 3 dB on ECG1 from 24600 s), each rendered from 100 s before the stretch.
    private static readonly (string Scenario, double FromS, double LengthS)[] s_motion =
    [
        ("noise-motion", 0, 240),
        ("demo-24h", 5000, 320),
        ("demo-24h", 24500, 260),
    ];

    [Fact]
    public void MotionNoise_WindowsAtOrBelow6Db_FlaggedNoisyOnTheAffectedLead()
    {
        int noisy = 0, flagged = 0, clean = 0, cleanGood = 0;
        foreach (var (name, fromS, lengthS) in s_motion)
        {
            var recording = QualityRun.Scenario(name);
            var start = (long)Math.Round(fromS * recording.SamplingRateHz);
            var truth = SyntheticNoiseTruth.Of(recording, start, (int)Math.Round(lengthS * recording.SamplingRateHz));
            var windows = QualityRun.Windows(truth.Signal, truth.SamplingRateHz);
            for (var k = 0; k < recording.Leads.Count; k++)
            {
                int n = 0, f = 0;
                for (var w = 0; w < windows.Count && w < truth.SnrDb[k].Length; w++)
                {
                    var state = windows[w].State(k);
                    if (truth.SnrDb[k][w] <= 6)
                    {
                        n++;
                        f += state is LeadState.Noisy or LeadState.Unreadable ? 1 : 0;
                    }
                    else if (double.IsPositiveInfinity(truth.SnrDb[k][w]))
                    {
                        clean++;
                        cleanGood += state == LeadState.Good ? 1 : 0;
                    }
                }

                noisy += n;
                flagged += f;
                // Information: the share of the whole scripted stretch flagged (its noise comes in bursts).
                var stretch = recording.Truth.Noise.FirstOrDefault(t => t.Kind == "electrode-motion" && t.Leads.Contains(recording.Leads[k])
                    && t.StartS >= fromS && t.EndS <= fromS + lengthS);
                var inStretch = stretch is null ? [] : windows.Where(w => w.StartS + fromS >= stretch.StartS && w.EndS + fromS <= stretch.EndS).ToList();
                output.WriteLine(FormattableString.Invariant(
                    $"{name} from {fromS} s, {recording.Leads[k]}: {f} of {n} windows at ≤ 6 dB flagged noisy; whole stretch {inStretch.Count(w => w.State(k) != LeadState.Good)} of {inStretch.Count}"));
            }
        }

        output.WriteLine(FormattableString.Invariant($"pooled: {flagged} of {noisy} ≤ 6 dB windows flagged ({100.0 * flagged / noisy:F1} %); {cleanGood} of {clean} noise-free windows good ({100.0 * cleanGood / clean:F2} %)"));
        Assert.True(noisy >= 30, $"only {noisy} windows at ≤ 6 dB: the scenarios changed");
        // A window at ≤ 6 dB carries noise RMS of at least 18 % of the QRS amplitude; most must be flagged.
        Assert.True(flagged >= 0.5 * noisy, $"{flagged} of {noisy} windows at ≤ 6 dB flagged noisy");
        Assert.True(cleanGood >= 0.99 * clean, $"{cleanGood} of {clean} noise-free windows good");
    }

    [Fact]
    public void MuscleNoise12Db_FlaggedOnEcg1Only_BaselineWanderLeftGood()
    {
        // noise-motion.json: muscle at 12 dB on ECG1 over 100–140 s; baseline wander at 10 dB over 160–210 s, which the
        // 0.5 Hz high-pass of the conditioning removes (its SNR after conditioning is above 20 dB).
        var recording = QualityRun.Scenario("noise-motion");
        var windows = QualityRun.Windows(QualityRun.Render(recording), recording.SamplingRateHz);
        var muscle = windows.Where(w => w.StartS >= 101 && w.EndS <= 139).ToList();
        var wander = windows.Where(w => w.StartS >= 161 && w.EndS <= 209).ToList();
        var ecg1 = muscle.Count(w => w.State(0) != LeadState.Good);
        var ecg2 = muscle.Count(w => w.State(1) == LeadState.Good);
        var wanderGood = wander.Count(w => w.State(0) == LeadState.Good && w.State(1) == LeadState.Good);
        output.WriteLine($"muscle: ECG1 not good in {ecg1} of {muscle.Count}, ECG2 good in {ecg2}; wander: both good in {wanderGood} of {wander.Count}");
        Assert.True(ecg1 >= 0.9 * muscle.Count, $"ECG1 flagged in {ecg1} of {muscle.Count} muscle windows");
        Assert.True(ecg2 >= 0.95 * muscle.Count, $"ECG2 good in {ecg2} of {muscle.Count} muscle windows");
        Assert.True(wanderGood >= 0.95 * wander.Count, $"both leads good in {wanderGood} of {wander.Count} wander windows");
        Assert.All(muscle.Concat(wander), w => Assert.True(w.Analysable));
    }
}
