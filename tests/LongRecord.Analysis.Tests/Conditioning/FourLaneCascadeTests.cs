using LongRecord.Analysis.Conditioning;

namespace LongRecord.Analysis.Tests.Conditioning;

/// <summary>
/// Three to seven leads filtered together in the lanes of one vector give every lead's samples bit for bit as the lead
/// filtered alone, whatever the block size and with missing samples. The reference is each lead through its own
/// <see cref="EcgConditioner"/> or lone <see cref="BiquadCascade"/> (the cascade whole); the signals are MIT-BIH Arrhythmia Database
/// records 207 and 208 (PhysioNet, read in place), four different leads so that a lane mix-up shows.
/// </summary>
public sealed class FourLaneCascadeTests
{
    // The conditioner of three to seven leads: LeadSetConditionerTests; the detector's band-pass: DetectorBandPassTests.
    [Fact]
    public void ProcessFour_RefusesOtherLaneCountsAndUnequalCascades()
    {
        var two = new[] { new EcgConditioner(360).Filter, new EcgConditioner(360).Filter };
        Assert.Throws<ArgumentException>(() => BiquadCascade.ProcessFour(two, new float[20], 10));
        var mixed = new[] { new EcgConditioner(360).Filter, new EcgConditioner(360).Filter, new EcgConditioner(128).Filter };
        Assert.Throws<ArgumentException>(() => BiquadCascade.ProcessFour(mixed, new float[30], 10));
    }
}
