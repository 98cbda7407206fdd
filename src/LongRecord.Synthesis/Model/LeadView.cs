namespace LongRecord.Synthesis.Model;

/// <summary>The body-surface view a synthetic lead resembles; it sets the sign and size of every wave.</summary>
public enum LeadView
{
    /// <summary>Inferior view like limb lead II: upright P, QRS and T.</summary>
    II,

    /// <summary>Right precordial view like V1: small r, deep S, biphasic P.</summary>
    V1,

    /// <summary>Left precordial view like V5: tall R, upright T.</summary>
    V5,
}
