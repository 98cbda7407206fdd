namespace LongRecord.Analysis.Quality;

/// <summary>How one lead looked during one quality window.</summary>
public enum LeadState : byte
{
    /// <summary>QRS complexes stand out clearly from the activity between them.</summary>
    Good,

    /// <summary>Noise between the complexes is marked, but the complexes still stand out; the lead is usable.</summary>
    Noisy,

    /// <summary>Noise as large as the complexes for at least a few seconds: nothing can be told apart.</summary>
    Unreadable,

    /// <summary>Continuous, narrow-band activity with no QRS on every lead carrying a signal (possible ventricular fibrillation or flutter).</summary>
    Chaotic,

    /// <summary>Constant or nearly constant signal: an electrode off, or no cardiac activity at all.</summary>
    Flat,

    /// <summary>Stuck at the channel's rail or on a clipping plateau.</summary>
    Saturated,

    /// <summary>Samples absent from the recording (gaps, NaN).</summary>
    Missing,
}

/// <summary>Helpers on <see cref="LeadState"/>.</summary>
public static class LeadStates
{
    /// <summary>True when beats may be detected and measured on the lead (good or noisy).</summary>
    public static bool IsUsable(this LeadState state) => state <= LeadState.Noisy;

    /// <summary>Lower-case code for output files (<c>good</c>, <c>noisy</c>, <c>unreadable</c>, <c>chaotic</c>, <c>flat</c>, <c>saturated</c>, <c>missing</c>).</summary>
    public static string Code(this LeadState state) => state switch
    {
        LeadState.Good => "good",
        LeadState.Noisy => "noisy",
        LeadState.Unreadable => "unreadable",
        LeadState.Chaotic => "chaotic",
        LeadState.Flat => "flat",
        LeadState.Saturated => "saturated",
        LeadState.Missing => "missing",
        _ => throw new ArgumentOutOfRangeException(nameof(state), state, "unknown lead state"),
    };
}
