using LongRecord.Analysis.Episodes;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Tests.Episodes;

/// <summary>
/// The noise-aware P-present share: how often an episode's beats must show a P wave to count as "a P before every
/// QRS" falls in proportion where the sinus beats before it show theirs less often than clean sinus beats do. The
/// expected values are worked by hand from the rule and the default settings (0.75 share, 0.9 of clean sinus beats);
/// the rule's effect is checked on the synthesiser's truth at 12 dB in the pipeline's episode tests.
/// </summary>
public sealed class PPresentShareTests
{
    private static readonly EpisodeSettings s_settings = new();

    [Fact]
    public void SinusBeatsShowingTheirPAsOftenAsCleanOnes_KeepTheSettingsShare()
    {
        Assert.Equal(0.75, AtrialActivity.PPresentShare(40, 36, s_settings), 12);
        Assert.Equal(0.75, AtrialActivity.PPresentShare(40, 40, s_settings), 12);
    }

    [Fact]
    public void SinusBeatsShowingTheirPLessOften_LowerTheShareInProportion()
    {
        // 64 % of the sinus beats before: 0.75 × 0.64 / 0.9.
        Assert.Equal(0.75 * 0.64 / 0.9, AtrialActivity.PPresentShare(50, 32, s_settings), 12);
    }

    [Fact]
    public void TooFewBeats_OrUnderHalfWithAP_AreNoSinusReference()
    {
        Assert.Equal(0.75, AtrialActivity.PPresentShare(9, 6, s_settings), 12);
        Assert.Equal(0.75, AtrialActivity.PPresentShare(50, 9, s_settings), 12);
    }
}
