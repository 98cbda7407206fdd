using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Episodes;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Tests.Episodes;

/// <summary>
/// Narrow tachycardias with P waves, told apart by their RR intervals alone (no signal: P shapes are not compared), on
/// hand-worked sequences. The rules are the trade's (the brief's clinical logic; the electrocardiography textbooks, from
/// memory): a sinus tachycardia starts and ends gradually, a focal atrial one abruptly; sinus rhythm with frequent
/// premature atrial beats is regular between them, while in AF and multifocal atrial tachycardia the conducted beats
/// themselves come irregularly. Three or more consecutive S beats are a run by the EC57 count, whatever their rate.
/// </summary>
public sealed class SinusOrAtrialTests
{
    private static readonly AnalysisSettings Settings = AnalysisSettings.Default;

    [Fact]
    public void SinusTachycardiaWithAPrematureAtrialBeatEveryFifth_RegularBetweenThem_IsSinusWithPacs()
    {
        // 20 s of sinus at 75/min, then 40 s at 107/min (RR 0.56 s) in which every fifth beat comes 0.40 s after the
        // one before, followed by a 0.72 s pause; then sinus at 75/min again.
        var rr = new List<double>();
        rr.AddRange(EpisodeTrack.Repeat(0.8, 25));
        var fast = new List<double>();
        for (var k = 0; k < 75; k++)
        {
            fast.Add(k % 5 == 3 ? 0.40 : k % 5 == 4 ? 0.72 : 0.56);
        }

        rr.AddRange(fast);
        rr.AddRange(EpisodeTrack.Repeat(0.8, 25));
        // Beat i ends RR i − 1: the premature beats end the 0.40 s intervals.
        var kind = KindOf(rr, i => i > 0 && i - 1 < rr.Count && rr[i - 1] == 0.40 ? BeatClass.S : BeatClass.N);

        Assert.Equal(EpisodeKinds.SinusWithPacs, kind);
    }

    [Fact]
    public void SamePrematureBeats_IrregularBetweenThem_IsNotSinusWithPacs()
    {
        // As above, but the intervals between normal beats vary beat to beat by about 20 % (0.45–0.58 s, all above
        // 100/min), so the rhythm under the premature beats is itself irregular.
        double[] normal = [0.46, 0.58, 0.49, 0.57, 0.45];
        var rr = new List<double>();
        rr.AddRange(EpisodeTrack.Repeat(0.8, 25));
        for (var k = 0; k < 75; k++)
        {
            rr.Add(k % 5 == 3 ? 0.40 : k % 5 == 4 ? 0.72 : normal[k % normal.Length]);
        }

        rr.AddRange(EpisodeTrack.Repeat(0.8, 25));
        var kind = KindOf(rr, i => i > 0 && i - 1 < rr.Count && rr[i - 1] == 0.40 ? BeatClass.S : BeatClass.N);

        Assert.NotNull(kind);
        Assert.NotEqual(EpisodeKinds.SinusWithPacs, kind);
    }

    [Theory]
    [InlineData(0.8, "atrial-tachycardia")]   // ends at once: 0.40 s → 0.80 s
    [InlineData(0.42, "sinus-tachycardia")]   // ends gradually: the rate falls back over 25 beats
    public void RegularTachycardiaFromTheRecordingsStart_TheEndDecides(double rrAfterS, string expected)
    {
        // 150/min from the first beat (so its onset is not observed), 45 s, P wave before every QRS.
        var rr = new List<double>(EpisodeTrack.Repeat(0.40, 112));
        if (rrAfterS < 0.5)
        {
            for (var k = 0; k < 25; k++)
            {
                rr.Add(0.40 + k * 0.016);
            }
        }

        rr.AddRange(EpisodeTrack.Repeat(0.8, 20));
        var kind = KindOf(rr, _ => BeatClass.N);

        Assert.Equal(expected, kind);
    }

    [Theory]
    [InlineData(0.8, 0.62)]    // three S beats at about 97/min after sinus at 75/min: slow, still a run of three
    [InlineData(0.56, 0.47)]   // three S beats (0.47, 0.52, 0.41 s) inside a sinus tachycardia at 107/min
    public void ThreeConsecutiveBeatsLabelledS_AreAnSveRun_WhateverTheirRate(double sinusRrS, double firstS)
    {
        // As SVDB 863 at 801 s (reference S S S with RR 0.47, 0.52, 0.41 s inside sinus at 0.57 s).
        double[] run = sinusRrS > 0.7 ? [firstS, 0.60, 0.64] : [firstS, 0.52, 0.41];
        List<double> rr = [.. EpisodeTrack.Repeat(sinusRrS, 40), .. run, sinusRrS * 1.2, .. EpisodeTrack.Repeat(sinusRrS, 40)];
        var t = EpisodeTrack.FromRr(rr, i => i is >= 41 and <= 43 ? BeatClass.S : BeatClass.N, pWaveOf: _ => 1, templateOf: _ => 0, qrsMsOf: _ => 90f);
        var candidates = CandidateFinder.Find(t, EpisodeTrack.NoRhythm(rr.Sum() + 2), Settings.Episodes, out _, out _);
        var sRun = Assert.Single(candidates, c => c.Source.HasFlag(CandidateSource.SveRun));

        var draft = CandidateDescriber.Describe(sRun, t, null, Settings);

        Assert.NotNull(draft);
        Assert.Equal(EpisodeKinds.SveRun, draft!.Episode.Kind);
        Assert.Equal(3, draft.Episode.Beats);
    }

    private static string? KindOf(List<double> rr, Func<int, BeatClass> classOf)
    {
        var t = EpisodeTrack.FromRr(rr, classOf, pWaveOf: _ => 1, templateOf: _ => 0, qrsMsOf: _ => 90f);
        var candidates = CandidateFinder.Find(t, EpisodeTrack.NoRhythm(rr.Sum() + 2), Settings.Episodes, out _, out _);
        var fast = Assert.Single(candidates, c => c.Source.HasFlag(CandidateSource.Fast));
        return CandidateDescriber.Describe(fast, t, null, Settings)?.Episode.Kind;
    }
}

/// <summary>
/// The classifier on its facts directly (what the signal stage would measure, set by hand). Flutter waves against a
/// sinus P: a regular narrow rhythm at 110/min whose mean cycle repeats within itself (the locked-wave finding) is still
/// sinus when a P like the sinus P stands before most QRS — as in MITDB 215 at 1210 s (no flutter label; P before 86 %
/// of QRS, 0.98 like the sinus P) — and flutter when no such P is there. The rule is the trade's: flutter has no P waves.
/// </summary>
public sealed class ClassifierFactsTests
{
    [Theory]
    [InlineData(0.86, 0.98, "sinus-tachycardia")]
    [InlineData(0.40, -0.90, "flutter")]
    public void LockedAtrialWaves_WithASinusPBeforeMostQrs_AreNotFlutter(double pBefore, double pVsSinus, string expected)
    {
        var s = AnalysisSettings.Default.Episodes;
        var facts = Facts(110, new OnsetMeasure("gradual", 0.95, "none", 0), new OffsetMeasure("gradual", 1.05, 0, "gradual", double.NaN), new AtrialFinding
        {
            Finding = "flutter-waves-locked",
            PBeforeShare = pBefore,
            PShapes = 1,
            SinusPCorrelation = pVsSinus,
            AtrialRateBpm = 220,
            LockedWaveIndex = 0.85,
        });

        var (kind, _, _, evidence, _) = TachycardiaClassifier.Classify(facts, s);

        Assert.Equal(expected, kind);
        Assert.Equal(expected == "sinus-tachycardia", evidence.Contains("not flutter", StringComparison.Ordinal));
    }

    /// <summary>
    /// A focal atrial tachycardia's warm-up against a sinus rate drifting across 100/min, both "gradual" by the onset
    /// ratio, with a P before every QRS whose shape differs from the sinus P (-0.6): the RR before the episode within
    /// 10 % of its first ones (0.97) and after it of its last ones (1.03) is a drift, sinus; a warm-up that shortens the
    /// RR by 16 % (0.84) and a cool-down that lengthens it by 15 % is the focus's, atrial.
    /// </summary>
    [Theory]
    [InlineData(0.97, 1.03, "sinus-tachycardia")]
    [InlineData(0.84, 1.15, "atrial-tachycardia")]
    public void PUnlikeSinus_GradualEdges_DriftIsSinus_WarmUpIsAtrial(double onsetRatio, double offsetRatio, string expected)
    {
        var facts = Facts(140, new OnsetMeasure("gradual", onsetRatio, "none", 2), new OffsetMeasure("gradual", offsetRatio, 2, "gradual", double.NaN), new AtrialFinding
        {
            Finding = "p-waves",
            PBeforeShare = 0.95,
            PShapes = 1,
            SinusPCorrelation = -0.6,
        });

        var (kind, _, _, _, _) = TachycardiaClassifier.Classify(facts, AnalysisSettings.Default.Episodes);

        Assert.Equal(expected, kind);
    }

    /// <summary>
    /// Premature atrial beats (a fifth of the beats) in a narrow rhythm at 107/min that is regular between them, with
    /// a P before the QRS unlike the sinus P (-0.7): where the rate drifts across 100/min at both ends the rhythm under
    /// them is sinus, sinus with PACs; where it starts at once (RR down by 30 %) and stops at once, a regular atrial
    /// focus with premature beats of its own, not sinus.
    /// </summary>
    [Theory]
    [InlineData(0.97, 1.03, "sinus-with-pacs")]
    [InlineData(0.70, 1.35, "atrial-tachycardia")]
    public void RegularBetweenPremature_PUnlikeSinus_SinusWithPacsOnlyWhereTheRateDrifts(double onsetRatio, double offsetRatio, string expected)
    {
        var abrupt = onsetRatio < 0.8;
        var facts = Facts(107, new OnsetMeasure(abrupt ? "abrupt" : "gradual", onsetRatio, "none", 0),
            new OffsetMeasure(abrupt ? "abrupt" : "gradual", offsetRatio, 0, abrupt ? "abrupt" : "gradual", double.NaN),
            new AtrialFinding { Finding = "p-waves", PBeforeShare = 0.9, PShapes = 2, DominantPShare = 0.8, SinusPCorrelation = -0.7 }) with
        {
            SShare = 0.2,
            NShare = 0.8,
            PrematureShare = 0.2,
            Regularity = new RrRegularity(110, 0.56, 0.15, 0.16),
            NormalRegularity = new RrRegularity(70, 0.56, 0.03, 0.02),
        };

        var (kind, _, _, _, _) = TachycardiaClassifier.Classify(facts, AnalysisSettings.Default.Episodes);

        Assert.Equal(expected, kind);
    }

    // A regular narrow run of normal-looking beats, 64 s, at the given rate, with the given edges and atrial finding.
    private static ClassifierFacts Facts(double bpm, OnsetMeasure onset, OffsetMeasure offset, AtrialFinding atrial)
    {
        var rr = 60 / bpm;
        return new ClassifierFacts
        {
            DurationS = 64,
            MeanBpm = bpm,
            MedianBpm = bpm,
            BeatQrsMs = 90,
            MeanComplexQrsMs = 90,
            VShare = 0,
            SShare = 0,
            NShare = 1,
            PrematureShare = 0,
            UsualQrsShare = 1,
            OddTemplateShare = 0,
            SplitShare = 0,
            Regularity = new RrRegularity((int)(64 / rr), rr, 0.04, 0.03),
            NormalRegularity = new RrRegularity((int)(64 / rr), rr, 0.04, 0.03),
            Onset = onset,
            Offset = offset,
            Atrial = atrial,
            AfShare = 0,
            RhythmAfLong = false,
            Source = CandidateSource.Fast,
        };
    }
}
