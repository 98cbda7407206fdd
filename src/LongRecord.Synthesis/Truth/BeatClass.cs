namespace LongRecord.Synthesis.Truth;

/// <summary>
/// Beat class as in the AAMI grouping (ANSI/AAMI EC57): N normal or conducted supraventricular rhythm beat (sinus,
/// AF, flutter), S supraventricular ectopic (premature atrial beats, SVE runs, focal and multifocal atrial
/// tachycardia, PSVT), V ventricular ectopic (PVCs, VE runs, broad-complex tachycardia).
/// </summary>
public enum BeatClass
{
    N,
    S,
    V,
}

/// <summary>What atrial wave a beat carries.</summary>
public enum PWaveKind
{
    /// <summary>No discrete P wave (PVC, AF, flutter, PSVT without retrograde P, broad-complex tachycardia).</summary>
    None,

    /// <summary>Sinus P wave before the QRS.</summary>
    Sinus,

    /// <summary>Ectopic atrial P wave before the QRS, of a shape unlike the sinus P.</summary>
    Ectopic,

    /// <summary>Retrograde P wave after the QRS (PSVT).</summary>
    Retrograde,
}

/// <summary>Whether a rhythm starts or stops from one beat to the next or over many beats.</summary>
public enum OnsetType
{
    Abrupt,
    Gradual,
}
