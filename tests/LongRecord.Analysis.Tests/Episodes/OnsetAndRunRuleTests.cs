using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Episodes;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Tests.Episodes;

/// <summary>
/// Onset and offset on hand-worked RR sequences (the onset ratio after Swerdlow et al. 1994, J Am Coll Cardiol
/// 23:1342 — each RR against the mean of the previous four; from memory), and the one-kind rule with the
/// ANSI/AAMI EC57 run classes (couplet, run of 3–5, run of ≥ 6). Expected values are worked by hand in each test.
/// </summary>
public sealed class OnsetAndRunRuleTests
{
    private static readonly EpisodeSettings s_settings = AnalysisSettings.Default.Episodes;

    [Fact]
    public void StepFrom75To150Bpm_OnsetRatio05_IsAbrupt_AndTheReturnIsAbrupt()
    {
        // 20 RR of 0.8 s (75 bpm), 30 of 0.4 s (150 bpm), 20 of 0.8 s. Beat k ends RR k − 1.
        var rr = EpisodeTrack.Repeat(0.8, 20).Concat(EpisodeTrack.Repeat(0.4, 30)).Concat(EpisodeTrack.Repeat(0.8, 20)).ToList();
        var t = EpisodeTrack.FromRr(rr);
        int first = 21, last = 50;   // the beats ending the 0.4 s intervals

        var onset = OnsetOffset.Onset(t, first, last, s_settings);
        var offset = OnsetOffset.Offset(t, first, last, s_settings);

        Assert.Equal("abrupt", onset.Type);
        Assert.Equal(0.5, onset.Ratio, 3);            // 0.4 / mean(0.8, 0.8, 0.8, 0.8)
        Assert.Equal(0.0, onset.WarmUpS, 3);         // the first fast RR is already steady
        Assert.Equal("abrupt", offset.Type);
        Assert.Equal(2.0, offset.Ratio, 3);          // 0.8 / mean of the last four (0.4)
    }

    [Fact]
    public void RampOf2PercentPerBeat_IsGradual()
    {
        // 20 RR of 0.8 s, then each RR 2 % shorter than the last down to 0.45 s, held 30 beats.
        var rr = EpisodeTrack.Repeat(0.8, 20);
        var x = 0.8;
        while (x > 0.45)
        {
            x *= 0.98;
            rr.Add(Math.Max(x, 0.45));
        }

        rr.AddRange(EpisodeTrack.Repeat(0.45, 30));
        var t = EpisodeTrack.FromRr(rr);
        // First beat above 100 bpm (RR < 0.6 s): 0.8 × 0.98^k < 0.6 from k = 15.
        var first = 20 + 15;

        var onset = OnsetOffset.Onset(t, first, rr.Count, s_settings);

        // The median of the first five RR, 0.8 × 0.98^17 = 0.566 s, over the four before, mean 0.8 × 0.98^12.5 = 0.622 s:
        // about 0.91, above the abrupt limit of 0.8.
        Assert.Equal("gradual", onset.Type);
        Assert.Equal(0.8 * Math.Pow(0.98, 17) / (0.8 * (Math.Pow(0.98, 11) + Math.Pow(0.98, 12) + Math.Pow(0.98, 13) + Math.Pow(0.98, 14)) / 4), onset.Ratio, 2);
        Assert.True(onset.WarmUpS > 0);
    }

    [Theory]
    [InlineData(false, "gradual")]
    [InlineData(true, "abrupt")]
    public void VariableConductionWhoseFirstRrMatchSinus_IsAbruptOnlyWhenThePWavesAreLost(bool pWavesLost, string expected)
    {
        // Flutter at 290/min (cycle 0.207 s) after 30 sinus RR of 0.8 s, each sinus beat with its P wave. The first
        // five flutter RR are 4:1, 3:1, 4:1, 3:1, 4:1 (0.83, 0.62, 0.83, 0.62, 0.83 s): their median, 0.83 s, over the
        // four sinus RR (0.8 s) is an onset ratio of 1.04, no rate step. Then 2:1, 3:1, 2:1, 4:1 repeated ten times:
        // the episode's median RR is 0.62 s, 0.78 of the sinus RR (at most 0.8 + 0.05). Flutter beats carry no P
        // wave before the QRS, unless the case keeps them (a sinus node would).
        var rr = EpisodeTrack.Repeat(0.8, 30);
        rr.AddRange([0.83, 0.62, 0.83, 0.62, 0.83]);
        for (var k = 0; k < 10; k++)
        {
            rr.AddRange([0.41, 0.62, 0.41, 0.83]);
        }

        const int first = 31;
        var t = EpisodeTrack.FromRr(rr, pWaveOf: i => i < first || !pWavesLost ? (sbyte)1 : (sbyte)0);

        var onset = OnsetOffset.Onset(t, first, rr.Count, s_settings);

        Assert.Equal(0.83 / 0.8, onset.Ratio, tolerance: 0.01);   // beats fall on 4 ms samples
        Assert.Equal(expected, onset.Type);
    }

    [Theory]
    [InlineData("svt", 10.0, 25, "sve-run", "run-6+")]
    [InlineData("atrial-tachycardia", 2.0, 5, "sve-run", "run-3-5")]
    [InlineData("broad-tachycardia", 1.5, 3, "ve-run", "run-3-5")]
    [InlineData("broad-tachycardia", 30.0, 80, "broad-tachycardia", "")]
    [InlineData("svt", 45.0, 130, "svt", "")]
    [InlineData("sinus-tachycardia", 20.0, 40, "sinus-tachycardia", "")]
    // EC57 counts ventricular runs by beats, not rate: a slow run of four is a run of 3–5; a slow ventricular rhythm
    // of 30 s or more is an idioventricular rhythm. A slow "junctional" or "ectopic atrial" candidate is made of beats
    // the beats stage labelled S (premature), so under 30 s it is an SVE run by the same count; only 30 s or more of
    // them is a rhythm of its own (EC57 counts runs of three or more ectopic beats by beats, from memory).
    [InlineData("idioventricular-rhythm", 3.0, 4, "ve-run", "run-3-5")]
    [InlineData("idioventricular-rhythm", 12.0, 9, "ve-run", "run-6+")]
    [InlineData("idioventricular-rhythm", 40.0, 30, "idioventricular-rhythm", "")]
    [InlineData("junctional-rhythm", 5.0, 5, "sve-run", "run-3-5")]
    [InlineData("ectopic-atrial-rhythm", 9.0, 8, "sve-run", "run-6+")]
    [InlineData("junctional-rhythm", 40.0, 35, "junctional-rhythm", "")]
    public void KindRule_Under30sEctopicIsARun_WithItsEc57RunClass(string kind, double durationS, int beats, string expectedKind, string expectedClass)
    {
        var (k, runClass) = EpisodeKindRule.Apply(kind, durationS, beats, s_settings.SustainedS);

        Assert.Equal(expectedKind, k);
        Assert.Equal(expectedClass, runClass);
    }

    [Fact]
    public void ThreeVBeatsAndACouplet_AreOneRunOfThreeAndOneCouplet()
    {
        // 20 N beats at 0.8 s, V V V (at 0.45 s), 10 N, V V, 10 N: EC57 counts a run of 3 and a couplet.
        var rr = EpisodeTrack.Repeat(0.8, 20).Concat(EpisodeTrack.Repeat(0.45, 3)).Concat(EpisodeTrack.Repeat(0.8, 10))
            .Concat(EpisodeTrack.Repeat(0.45, 2)).Concat(EpisodeTrack.Repeat(0.8, 10)).ToList();
        var t = EpisodeTrack.FromRr(rr, i => i is >= 21 and <= 23 or >= 34 and <= 35 ? BeatClass.V : BeatClass.N);

        var candidates = CandidateFinder.Find(t, EpisodeTrack.NoRhythm(60), s_settings, out var sveCouplets, out var veCouplets);

        var run = Assert.Single(candidates, c => c.Source.HasFlag(CandidateSource.VeRun));
        Assert.Equal(21, run.First);
        Assert.Equal(23, run.Last);
        Assert.Equal(1, veCouplets);
        Assert.Equal(0, sveCouplets);
    }

    [Theory]
    [InlineData(0.45, true)]
    [InlineData(0.8, false)]
    public void VCoupletAfterABeatOfAMostlyVShape_IsARunOfThree_OnlyAtTachycardiaRate(double runRrS, bool expectRun)
    {
        // Template 0 the normal shape; template 5 a ventricular shape the beats stage labels V four times (beats 11–14
        // at 0.45 s). Later a beat of template 5 labelled N, then a V couplet of template 5: at 0.45 s the three beats
        // are one ventricular run (our rule: the first beat of a run often carries a label of its own in multiform
        // records, MITDB 203); at 0.8 s (75/min) the labels stand and there is only the couplet.
        var rr = EpisodeTrack.Repeat(0.8, 10).Concat(EpisodeTrack.Repeat(0.45, 4)).Concat(EpisodeTrack.Repeat(0.8, 16))
            .Concat(EpisodeTrack.Repeat(runRrS, 3)).Concat(EpisodeTrack.Repeat(0.8, 10)).ToList();
        var t = EpisodeTrack.FromRr(rr,
            classOf: i => i is >= 11 and <= 14 or 32 or 33 ? BeatClass.V : BeatClass.N,
            templateOf: i => i is >= 11 and <= 14 or >= 31 and <= 33 ? (short)5 : (short)0);

        var candidates = CandidateFinder.Find(t, EpisodeTrack.NoRhythm(60), s_settings, out _, out var veCouplets);

        var runs = candidates.Where(c => c.Source.HasFlag(CandidateSource.VeRun) && c.First >= 30).ToList();
        Assert.Equal(1, veCouplets);
        if (expectRun)
        {
            var run = Assert.Single(runs);
            Assert.Equal(31, run.First);
            Assert.Equal(33, run.Last);
        }
        else
        {
            Assert.Empty(runs);
        }
    }

    [Theory]
    [InlineData(140f, true)]
    [InlineData(85f, false)]
    public void BroadQBetweenTwoBroadVOfOneShape_IsARunOfThree_ANarrowQIsNot(float qQrsMs, bool expectRun)
    {
        // Normal beats of template 0 (90 ms) at 0.8 s; beats 21 and 23 V of template 5 (145 ms) with beat 22 between
        // them unclassifiable (Q, another template). Our rule (MITDB 223 at 1442 s: V 144, Q 137, V 154 ms on one
        // ventricular template, a reference VT of three beats): a broad Q there is part of the run. A narrow Q is the
        // normal beat of a bigeminy the beats stage could not label (MITDB 200 at 790 s: 85 ms): no run, no couplet.
        var rr = EpisodeTrack.Repeat(0.8, 20).Concat(EpisodeTrack.Repeat(0.5, 3)).Concat(EpisodeTrack.Repeat(0.8, 10)).ToList();
        var t = EpisodeTrack.FromRr(rr,
            classOf: i => i is 21 or 23 ? BeatClass.V : i == 22 ? BeatClass.Q : BeatClass.N,
            templateOf: i => i is 21 or 23 ? (short)5 : i == 22 ? (short)7 : (short)0,
            qrsMsOf: i => i is 21 or 23 ? 145f : i == 22 ? qQrsMs : 90f);

        var candidates = CandidateFinder.Find(t, EpisodeTrack.NoRhythm(60), s_settings, out _, out var veCouplets);

        var runs = candidates.Where(c => c.Source.HasFlag(CandidateSource.VeRun)).ToList();
        Assert.Equal(0, veCouplets);
        if (expectRun)
        {
            var run = Assert.Single(runs);
            Assert.Equal(21, run.First);
            Assert.Equal(23, run.Last);
        }
        else
        {
            Assert.Empty(runs);
        }
    }
}
