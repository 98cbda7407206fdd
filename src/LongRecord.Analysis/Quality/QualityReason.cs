namespace LongRecord.Analysis.Quality;

/// <summary>
/// Why a quality window is or is not analysable (column <c>reason</c> of <c>quality.csv</c>). Flat and chaotic
/// signal on every lead have reasons of their own: the episodes stage flags them as possible asystole or lead-off and
/// possible ventricular fibrillation; they are never only excluded.
/// </summary>
public enum QualityReason : byte
{
    /// <summary>At least one lead is usable.</summary>
    Ok,

    /// <summary>Every lead carrying a signal is unreadable through noise.</summary>
    Noise,

    /// <summary>Every lead is flat, saturated or missing, in a mixture.</summary>
    LeadOff,

    /// <summary>Every lead carrying a signal is saturated.</summary>
    Saturation,

    /// <summary>Every lead is missing.</summary>
    Missing,

    /// <summary>Every lead that is not missing is flat: possible asystole or lead-off.</summary>
    FlatAllLeads,

    /// <summary>Every lead carrying a signal shows continuous activity with no QRS: possible ventricular fibrillation or flutter.</summary>
    ChaoticAllLeads,
}

/// <summary>Helpers on <see cref="QualityReason"/>.</summary>
public static class QualityReasons
{
    /// <summary>The code written to <c>quality.csv</c>: <c>ok</c>, <c>noise</c>, <c>lead-off</c>, <c>saturation</c>, <c>missing</c>, <c>flat-all-leads</c>, <c>chaotic-all-leads</c>.</summary>
    public static string Code(this QualityReason reason) => reason switch
    {
        QualityReason.Ok => "ok",
        QualityReason.Noise => "noise",
        QualityReason.LeadOff => "lead-off",
        QualityReason.Saturation => "saturation",
        QualityReason.Missing => "missing",
        QualityReason.FlatAllLeads => "flat-all-leads",
        QualityReason.ChaoticAllLeads => "chaotic-all-leads",
        _ => throw new ArgumentOutOfRangeException(nameof(reason), reason, "unknown quality reason"),
    };
}
