using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Beats.Classification;

namespace LongRecord.Analysis.Tests.Classification;

/// <summary>
/// The beat rules on hand-set features (no signal): an on-time beat only somewhat unlike the normal one (correlation
/// 0.8, between the "different" 0.7 and the "normal" 0.9 of the settings) and not wider than it is V when its cluster's
/// beats were mostly decided V — a ventricular focus beating on time (a run at the sinus rate, the beat after a
/// pause) keeps its cluster's origin — and N when they were mostly not (a conducted beat of a slightly changed shape).
/// </summary>
public sealed class VentricularClusterTests
{
    [Theory]
    [InlineData(0.8, BeatClass.V)]
    [InlineData(0.2, BeatClass.N)]
    public void OnTimeBeatSomewhatUnlikeNormal_TakesItsClustersOrigin(double clusterVShare, BeatClass expected)
    {
        var settings = ClassificationSettings.Default;
        var decision = new BeatDecision(settings, new RhythmContext(settings));
        // Twenty sinus beats at 0.8 s make the local rhythm.
        for (var i = 0; i < 20; i++)
        {
            decision.Decide(Beat(0.8, normal: true, correlation: 1, vShare: 0), 0.8);
        }

        var (cls, flags) = decision.Decide(Beat(0.8, normal: false, correlation: 0.8, vShare: clusterVShare), 0.8);

        Assert.Equal(BeatFlags.None, flags);   // on time: not premature
        Assert.Equal(expected, cls);
    }

    private static BeatClassifier.Pending Beat(double rrS, bool normal, double correlation, double vShare) => new()
    {
        RrPrevS = rrS,
        PWave = -1,
        Valid = true,
        Template = (short)(normal ? 0 : 1),
        IsNormalTemplate = normal,
        CorrelationToNormal = correlation,
        AmplitudeToNormal = 1,
        WidthMs = 90,
        ExtraWidthMs = 0,
        NormalWidthMs = 90,
        Noise = 0.03f,
        SameShapeCorrelation = 1,   // clean: noise takes nothing from a same-shape beat's correlation
        NarrowerLimitMs = ClassificationSettings.Default.NarrowerMs,
        TemplateVentricularShare = vShare,
        AtrialCorrelation = double.NaN,
        AtrialToPrevious = double.NaN,
    };
}
