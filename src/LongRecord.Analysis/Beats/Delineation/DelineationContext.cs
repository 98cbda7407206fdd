namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>
/// What the caller knows around one beat. Positions are sample indices inside the window handed to
/// <see cref="BeatDelineator.Delineate"/>; they may lie outside it (negative, or at or past its length).
/// </summary>
/// <param name="PreviousFiducial">The previous beat's fiducial, relative to the window, or null when there is none.</param>
/// <param name="NextFiducial">The next beat's fiducial, relative to the window, or null when not yet known.</param>
/// <param name="UsableLeadMask">Bit k set when lead k may be used (not off, not saturated); 0 is read as all leads.</param>
public readonly record struct DelineationContext(int? PreviousFiducial, int? NextFiducial, ulong UsableLeadMask)
{
    /// <summary>No neighbours known, every lead usable.</summary>
    public static DelineationContext AllLeads => new(null, null, 0);
}
