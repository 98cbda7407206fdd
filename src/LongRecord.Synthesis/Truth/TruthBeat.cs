namespace LongRecord.Synthesis.Truth;

/// <summary>
/// Ground truth for one QRS complex. Times are seconds from the first sample; samples are round(time × rate).
/// R is the beat's fiducial point (largest excursion of its QRS in the first lead); QRS onset/offset and T end follow
/// the 2 % definitions documented on <c>LeadMorphologies</c> and in <c>fixtures/scenarios/README.md</c>.
/// </summary>
public readonly record struct TruthBeat(
    int Index,
    double RTimeS,
    long RSample,
    BeatClass Class,
    string Morphology,
    bool IsBroad,
    double QrsOnsetS,
    double QrsOffsetS,
    long QrsOnsetSample,
    long QrsOffsetSample,
    PWaveKind PWave,
    double? PPeakS,
    long? PPeakSample,
    string? PShape,
    double TEndS,
    long TEndSample,
    double? RrS)
{
    public double QrsWidthMs => (QrsOffsetS - QrsOnsetS) * 1000.0;
}

/// <summary>A P wave with no QRS of its own: blocked (AV block, blocked P) or dissociated (during broad-complex tachycardia).</summary>
public readonly record struct TruthPWave(double PeakS, long PeakSample, bool IsNonConducted, string Shape);
