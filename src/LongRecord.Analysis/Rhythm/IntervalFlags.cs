namespace LongRecord.Analysis.Rhythm;

/// <summary>Facts about one RR interval (the interval that ends at a beat).</summary>
[Flags]
internal enum IntervalFlags : byte
{
    None = 0,

    /// <summary>Both beats lie in one analysable stretch and the interval is no longer than the beat-gap limit.</summary>
    Analysable = 1,

    /// <summary>Normal-to-normal: both beats N, outside AF, passed the artefact filter.</summary>
    Nn = 2,

    /// <summary>Inside an AF episode (at least the minimum duration).</summary>
    Af = 4,

    /// <summary>Inside an AF-like stretch shorter than the minimum episode.</summary>
    AfBrief = 8,

    /// <summary>Judged fibrillation-like by the detector, before episode rules.</summary>
    AfLike = 16,

    /// <summary>Left out of the AF irregularity measure by ectopic beat filtering.</summary>
    EctopicExcluded = 32,

    /// <summary>The detector could not judge the window around it (too few intervals kept).</summary>
    Unjudged = 64,

    /// <summary>
    /// Left out of the AF measure as a dropout: outside the conducted range, so a missed or spurious detection rather
    /// than a beat of the rhythm. Takes no room in the AF detector's window.
    /// </summary>
    Dropout = 128,
}
