namespace LongRecord.Analysis.Beats;

/// <summary>Beat classes of ANSI/AAMI EC57 (§3.1, beat-label mapping of the MIT-BIH codes).</summary>
public enum BeatClass : byte
{
    /// <summary>Normal or bundle-branch-block beat, any beat of sinus or other supraventricular origin that is not ectopic.</summary>
    N,

    /// <summary>Supraventricular ectopic beat (premature atrial, junctional or nodal).</summary>
    S,

    /// <summary>Ventricular ectopic beat.</summary>
    V,

    /// <summary>Fusion of a ventricular and a normal beat.</summary>
    F,

    /// <summary>Unclassifiable (including paced beats).</summary>
    Q,
}
