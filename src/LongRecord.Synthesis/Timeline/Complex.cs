namespace LongRecord.Synthesis.Timeline;

/// <summary>
/// One scheduled cardiac event: a beat (QRS with optional P) or a lone P wave. 32 bytes; the whole schedule of a
/// recording is an array of these sorted by <see cref="AnchorS"/>.
/// </summary>
internal struct Complex
{
    public const byte NoMorph = 255;
    public const byte ClassNonConductedP = 3;
    public const byte ClassDissociatedP = 4;

    /// <summary>Fiducial (truth R) time, or NaN for a lone P wave.</summary>
    public double RTimeS;

    /// <summary>P wave reference time (peak), or NaN when the beat has none.</summary>
    public double PTimeS;

    /// <summary>RR ending at this beat, which sets T timing.</summary>
    public float RrS;

    public float QrsScale;
    public float PScale;

    /// <summary>Morphology index, or <see cref="NoMorph"/> for a lone P.</summary>
    public byte Morph;

    public byte PShape;

    /// <summary>BeatClass for beats; <see cref="ClassNonConductedP"/> or <see cref="ClassDissociatedP"/> for lone P waves.</summary>
    public byte Class;

    /// <summary>Rhythm label code in force (see <c>RhythmLabels</c>).</summary>
    public byte Label;

    public readonly bool IsBeat => Morph != NoMorph;

    public readonly double AnchorS => IsBeat ? RTimeS : PTimeS;
}

/// <summary>A stretch of continuous (not beat-locked) activity.</summary>
internal enum ContinuousKind
{
    FlutterWaves,
    FibrillatoryWaves,
    VentricularFlutter,
    VentricularFibrillation,
}

/// <param name="RateHz">Flutter: atrial rate; fibrillatory waves: mean frequency; ventricular flutter: wave rate.</param>
/// <param name="PhaseOriginS">Time at which the flutter sawtooth has phase 0 (its sharp turn).</param>
internal sealed record ContinuousSource(ContinuousKind Kind, double StartS, double EndS, ulong Seed, double RateHz, double Scale, double PhaseOriginS);
