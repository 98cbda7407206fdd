namespace LongRecord.Analysis.Beats;

/// <summary>How well the leads showed a beat (column <c>lead_quality</c> of <c>beats.csv</c>).</summary>
public enum LeadQuality : byte
{
    /// <summary>Seen clearly on at least two usable leads, or on the only lead of a one-lead recording that is clean.</summary>
    Good,

    /// <summary>Seen, but the lead it was seen on carried noise around it.</summary>
    Noisy,

    /// <summary>Seen on one usable lead only (the others unusable or silent at that moment).</summary>
    SingleLead,

    /// <summary>Not judged: the beat came from an annotation file with no signal to look at.</summary>
    Unknown,
}
