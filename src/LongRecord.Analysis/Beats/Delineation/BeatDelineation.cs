namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>
/// The boundaries of one beat, as sample indices inside the window given to <see cref="BeatDelineator.Delineate"/>;
/// −1 where a point was not found.
/// </summary>
/// <param name="QrsOnset">Multilead QRS onset: the earliest reliable onset over the usable leads.</param>
/// <param name="QrsOffset">Multilead QRS offset (J point): the latest reliable offset over the usable leads.</param>
/// <param name="QrsMs">QRS width in milliseconds (offset − onset), or NaN when either end is missing.</param>
/// <param name="RPeak">The dominant deflection of the QRS on the clearest lead: the beat's fiducial point for output.</param>
/// <param name="PWave">1 when a P wave was found in the PR window, 0 when it was looked for and not found, −1 when not judged.</param>
/// <param name="PPeak">The P wave's peak (its largest deflection from the local baseline), or −1.</param>
/// <param name="TEnd">T-wave end, or −1 when the T wave could not be delimited.</param>
/// <param name="Confidence">
/// How far the QRS boundaries rest on more than one lead (mean over onset and offset): 1 for two or more reliable leads,
/// 0.75 when one of three or more was set aside as an outlier, 0.5 for one lead only or two leads that disagree by more
/// than <see cref="DelineationSettings.LeadOutlierMs"/>, 0 when not found.
/// </param>
public readonly record struct BeatDelineation(int QrsOnset, int QrsOffset, float QrsMs, int RPeak, sbyte PWave, int PPeak, int TEnd, float Confidence)
{
    /// <summary>Nothing found (no usable lead, or no QRS near the fiducial).</summary>
    public static BeatDelineation None => new(-1, -1, float.NaN, -1, -1, -1, -1, 0);

    public bool HasQrsBounds => QrsOnset >= 0 && QrsOffset >= 0;
}
