namespace LongRecord.Analysis.Beats;

/// <summary>
/// One detected beat. Positions are sample indices on the recording's reference rate (<c>f_ref</c>); offsets are
/// relative to <see cref="Sample"/>. Kept to 32 bytes: a 14-day recording holds about 1.5 million of them.
/// </summary>
public struct Beat
{
    public const short Unknown = short.MinValue;

    /// <summary>Fiducial point, 0-based sample index at <c>f_ref</c>.</summary>
    public long Sample;

    /// <summary>QRS onset relative to <see cref="Sample"/>, in samples, or <see cref="Unknown"/>.</summary>
    public short QrsOnOffset;

    /// <summary>QRS offset relative to <see cref="Sample"/>, in samples, or <see cref="Unknown"/>.</summary>
    public short QrsOffOffset;

    /// <summary>P-wave peak relative to <see cref="Sample"/>, or <see cref="Unknown"/>.</summary>
    public short PPeakOffset;

    /// <summary>T-wave end relative to <see cref="Sample"/>, or <see cref="Unknown"/>.</summary>
    public short TEndOffset;

    /// <summary>QRS width in milliseconds, or NaN when not measured.</summary>
    public float QrsMs;

    /// <summary>Morphology cluster of this recording the beat belongs to, or −1.</summary>
    public short Template;

    public BeatClass Class;

    public LeadQuality LeadQuality;

    /// <summary>1 when a P wave was found in the PR window, 0 when it was looked for and not found, −1 when not judged.</summary>
    public sbyte PWave;

    public BeatFlags Flags;

    public readonly bool HasQrsBounds => QrsOnOffset != Unknown && QrsOffOffset != Unknown;

    /// <summary>A beat known only by its position and class (from annotations, or an RR series): nothing measured.</summary>
    public static Beat Unmeasured(long sample, BeatClass beatClass, BeatFlags flags = BeatFlags.None, sbyte pWave = -1) => new()
    {
        Sample = sample,
        QrsOnOffset = Unknown,
        QrsOffOffset = Unknown,
        PPeakOffset = Unknown,
        TEndOffset = Unknown,
        QrsMs = float.NaN,
        Template = -1,
        Class = beatClass,
        PWave = pWave,
        LeadQuality = LeadQuality.Unknown,
        Flags = flags,
    };
}

/// <summary>Facts about how a beat's class was reached.</summary>
[Flags]
public enum BeatFlags : byte
{
    None = 0,

    /// <summary>The class comes from RR rules alone (re-analysis of unlabelled beats, or no usable signal).</summary>
    RrOnly = 1,

    /// <summary>The beat came from an annotation file (re-analysis mode), not from detection.</summary>
    FromAnnotation = 2,

    /// <summary>The beat was recovered by search-back at a lowered threshold.</summary>
    SearchBack = 4,

    /// <summary>Premature against the local rhythm.</summary>
    Premature = 8,

    /// <summary>The class is a reviewed annotation's label, kept as given.</summary>
    Labelled = 16,
}
