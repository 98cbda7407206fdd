using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Rhythm;

namespace LongRecord.Analysis.Tests.Rhythm;

/// <summary>
/// A P wave not found in a noisy stretch says nothing about the atria: it must not relax the AF detector's RR criteria
/// as absent P waves in clean signal do. Rhythm known by construction: sinus at 0.8 s whose intervals scatter by up to
/// ±<see cref="JitterFraction"/> (sinus arrhythmia plus fiducial jitter in noise — a synthetic stand-in, common
/// practice, no source), every beat with its P wave looked for and not found.
/// </summary>
public sealed class NoisyAtrialEvidenceTests
{
    private const double JitterFraction = 0.09;

    [Theory]
    [InlineData(LeadQuality.Noisy, false)]
    [InlineData(LeadQuality.Good, true)]
    public void ScatteredSinusWithoutPWaves_IsAfLikeOnlyWhereTheMissingPWavesAreEvidence(LeadQuality quality, bool afLikeExpected)
    {
        var random = new Random(7);
        var rr = Enumerable.Range(0, 1500).Select(_ => 0.8 * (1 + JitterFraction * (2 * random.NextDouble() - 1))).ToList();
        var beats = SyntheticBeats.FromRr(rr, pWave: 0);
        for (var i = 0; i < beats.Length; i++)
        {
            beats[i].LeadQuality = quality;
        }

        var result = RhythmAnalyser.Analyse(new RhythmInput { Beats = beats, ReferenceRateHz = 1000, DurationS = SyntheticBeats.EndS(beats) });
        var afLikeS = result.Episodes.Where(e => e.Kind is RhythmEpisode.AfKind or RhythmEpisode.AfBriefKind).Sum(e => e.EndS - e.StartS);

        if (afLikeExpected)
        {
            // The control: in clean signal the same RRs without P waves do read as AF-like somewhere, so the noisy
            // case below tests the evidence rule, not an RR series too regular to matter.
            Assert.True(afLikeS > 0, "clean beats without P waves gave no AF-like stretch: the control does not control");
        }
        else
        {
            Assert.True(afLikeS == 0, $"noisy beats without P waves gave {afLikeS:F0} s of AF-like stretches");
        }
    }
}
