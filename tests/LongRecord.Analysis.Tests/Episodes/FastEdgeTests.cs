using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Episodes;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Tests.Episodes;

/// <summary>
/// The ends of a run of fast beats (the issue: runs above 100 bpm, merged across short interruptions; the merge gap of
/// 3 slower beats is common practice, no source) on hand-worked RR sequences: fast intervals too few to make a run of
/// their own, within the merge gap of the run, belong to it; a premature S beat's interval does not.
/// </summary>
public sealed class FastEdgeTests
{
    private static readonly EpisodeSettings s_settings = AnalysisSettings.Default.Episodes;

    // RR: 20 × 0.8 s, 0.55, 0.55 (two fast, under the three of a run), 0.65 (one slower), 20 × 0.5 s (the run), 20 × 0.8 s.
    // Beat i ends RR i − 1: the run is beats 24–43, the two fast intervals end at beats 21 and 22.
    private static List<double> Rr() =>
        [.. EpisodeTrack.Repeat(0.8, 20), 0.55, 0.55, 0.65, .. EpisodeTrack.Repeat(0.5, 20), .. EpisodeTrack.Repeat(0.8, 20)];

    [Fact]
    public void TwoFastIntervalsOneSlowBeatBeforeARun_StartTheEpisode()
    {
        var t = EpisodeTrack.FromRr(Rr());

        var c = Assert.Single(CandidateFinder.Find(t, EpisodeTrack.NoRhythm(70), s_settings, out _, out _));

        Assert.Equal(21, c.First);
        Assert.Equal(43, c.Last);
    }

    [Fact]
    public void TheSameIntervalsAroundAPrematureSBeat_LeaveTheStartAtTheRun()
    {
        var t = EpisodeTrack.FromRr(Rr(), i => i == 22 ? BeatClass.S : BeatClass.N);

        var c = Assert.Single(CandidateFinder.Find(t, EpisodeTrack.NoRhythm(70), s_settings, out _, out _));

        Assert.Equal(24, c.First);
        Assert.Equal(43, c.Last);
    }
}
