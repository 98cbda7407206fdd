using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Episodes;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Tests.Episodes;

/// <summary>
/// Extra detections against premature beats, on a hand-worked sequence: three beats of shapes seen nowhere else whose
/// first two intervals (0.43 + 0.44 s) add up to the sinus RR before them (0.84 s, within 10 %), the mark of a normal
/// interval split by an extra detection. An extra detection leaves the next beat on time; ventricular beats are
/// followed by a compensatory pause (the electrocardiography textbooks' mark of a ventricular beat, from memory).
/// </summary>
public sealed class SplitIntervalTests
{
    [Theory]
    [InlineData(0.84, false)]   // the beat after them on time: an extra detection, no episode
    [InlineData(1.45, true)]    // a pause after them (1.45 s ≥ 1.2 × 0.84 s): premature beats, a ve-run
    public void ThreeOneOffVBeatsSplittingTheSinusRr_AreARunOnlyWhenAPauseFollows(double rrAfterS, bool isRun)
    {
        // Beat i ends RR i − 1: beats 21–23 end the three short intervals and are V, each of a template of its own.
        List<double> rr = [.. EpisodeTrack.Repeat(0.84, 20), 0.43, 0.44, 0.38, rrAfterS, .. EpisodeTrack.Repeat(0.84, 10)];
        var t = EpisodeTrack.FromRr(rr, i => i is >= 21 and <= 23 ? BeatClass.V : BeatClass.N, templateOf: i => i is >= 21 and <= 23 ? (short)(i - 20) : (short)0);
        var settings = AnalysisSettings.Default;
        var run = Assert.Single(CandidateFinder.Find(t, EpisodeTrack.NoRhythm(40), settings.Episodes, out _, out _), c => c.Source.HasFlag(CandidateSource.VeRun));

        var draft = CandidateDescriber.Describe(run, t, null, settings);

        Assert.Equal(isRun, draft is not null);
        if (isRun)
        {
            Assert.Equal(EpisodeKinds.VeRun, draft!.Episode.Kind);
        }
    }
}
