using LongRecord.Analysis.Conditioning;

namespace LongRecord.Analysis.Tests.Conditioning;

/// <summary>
/// The four-lane kernel's contract: it takes three or four cascades of one section count and refuses anything else.
/// What it computes is checked lane by lane against each lead alone in LeadSetConditionerTests (the conditioner) and
/// DetectorBandPassTests (the detector's band-pass).
/// </summary>
public sealed class FourLaneCascadeTests
{
    [Fact]
    public void ProcessFour_RefusesOtherLaneCountsAndUnequalCascades()
    {
        var two = new[] { new EcgConditioner(360).Filter, new EcgConditioner(360).Filter };
        Assert.Throws<ArgumentException>(() => BiquadCascade.ProcessFour(two, new float[20], 10));
        var mixed = new[] { new EcgConditioner(360).Filter, new EcgConditioner(360).Filter, new EcgConditioner(128).Filter };
        Assert.Throws<ArgumentException>(() => BiquadCascade.ProcessFour(mixed, new float[30], 10));
    }
}
