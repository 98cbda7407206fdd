namespace LongRecord.Analysis.Beats.Classification;

/// <summary>A beat whose class has been decided.</summary>
/// <param name="Sample">Fiducial sample index, as given to the classifier.</param>
/// <param name="Class">EC57 class.</param>
/// <param name="Template">Morphology cluster of the recording the beat joined, or −1 (RR-only, or no usable signal).</param>
/// <param name="Flags"><see cref="BeatFlags.Premature"/> and <see cref="BeatFlags.RrOnly"/> as they apply.</param>
/// <param name="QrsMs">QRS width used for the decision (the caller's, else the classifier's own estimate), or NaN.</param>
public readonly record struct ClassifiedBeat(long Sample, BeatClass Class, short Template, BeatFlags Flags, float QrsMs)
{
    /// <summary>
    /// In a noisy window, the QRS onset and offset of the beat's template (offsets from the fiducial) and its width;
    /// null when the beat's own boundaries stand.
    /// </summary>
    public (int OnOffset, int OffOffset, float Ms)? TemplateQrs { get; init; }
}
