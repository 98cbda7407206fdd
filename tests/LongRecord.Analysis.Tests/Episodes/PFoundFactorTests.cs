using LongRecord.Analysis.Episodes;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Tests.Episodes;

/// <summary>
/// The noise factor of the P-wave share tests: how often an episode's beats must show a P wave falls in proportion
/// where the sinus beats before it show theirs less often than clean sinus beats do. The expected values are worked by
/// hand from the rule and the default settings (clean sinus beats show their P in 0.9); the rule's effect is checked on
/// the synthesiser's truth at 12 dB in the pipeline's episode tests.
/// </summary>
public sealed class PFoundFactorTests
{
    private static readonly EpisodeSettings s_settings = new();

    [Fact]
    public void SinusBeatsShowingTheirPAsOftenAsCleanOnes_LeaveTheSharesAsSet()
    {
        Assert.Equal(1, AtrialActivity.PFoundFactor(0.9, s_settings), 12);
        Assert.Equal(1, AtrialActivity.PFoundFactor(1.0, s_settings), 12);
    }

    [Fact]
    public void SinusBeatsShowingTheirPLessOften_LowerTheSharesInProportion()
    {
        // 64 % of the sinus beats before: 0.64 / 0.9.
        Assert.Equal(0.64 / 0.9, AtrialActivity.PFoundFactor(0.64, s_settings), 12);
    }

    [Fact]
    public void NotMeasured_OrUnderHalfWithAP_AreNoSinusReference()
    {
        Assert.Equal(1, AtrialActivity.PFoundFactor(double.NaN, s_settings), 12);
        Assert.Equal(1, AtrialActivity.PFoundFactor(0.18, s_settings), 12);
    }
}
