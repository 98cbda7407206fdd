namespace LongRecord.Synthesis.Scenarios;

/// <summary>Which parameters each rhythm accepts, and their ranges (ours; the ranges follow the rhythm's definition).</summary>
internal static class SegmentRules
{
    public static readonly RhythmKind[] SinusLike = [RhythmKind.Sinus, RhythmKind.SinusBradycardia, RhythmKind.SinusTachycardia];

    /// <summary>Allowed rate range for each rhythm's <c>rateBpm</c>, or null when the rhythm takes none.</summary>
    public static (double Min, double Max)? RateRange(RhythmKind kind) => kind switch
    {
        RhythmKind.Sinus => (40, 180),
        RhythmKind.SinusBradycardia => (25, 49.9),
        RhythmKind.SinusTachycardia => (100, 200),
        RhythmKind.FocalAtrialTachycardia => (100, 250),
        RhythmKind.Psvt => (150, 250),
        RhythmKind.AtrialFibrillation => (40, 200),
        RhythmKind.MultifocalAtrialTachycardia => (101, 160),
        RhythmKind.VentricularBigeminy or RhythmKind.VentricularTrigeminy or RhythmKind.SecondDegreeAvBlock => (40, 150),
        RhythmKind.BroadComplexTachycardia => (120, 220),
        RhythmKind.VentricularFlutter => (200, 350),
        _ => null,
    };

    /// <summary>Optional parameter names beyond <c>rhythm</c>, <c>durationS</c> and <c>rateBpm</c>.</summary>
    public static IReadOnlySet<string> Extras(RhythmKind kind) => kind switch
    {
        RhythmKind.Sinus or RhythmKind.SinusBradycardia => new HashSet<string> { "ectopy", "events" },
        RhythmKind.SinusTachycardia => new HashSet<string> { "ectopy", "events", "rampUpS", "rampDownS" },
        RhythmKind.FocalAtrialTachycardia => new HashSet<string> { "pShape", "warmUpBeats" },
        RhythmKind.Psvt => new HashSet<string> { "retrogradeP", "endPauseS" },
        RhythmKind.AtrialFlutter => new HashSet<string> { "atrialRateBpm", "conduction" },
        RhythmKind.AtrialFibrillation => new HashSet<string> { "rrCv", "fibrillatoryWaveScale" },
        RhythmKind.MultifocalAtrialTachycardia => new HashSet<string> { "rrCv" },
        RhythmKind.VentricularBigeminy or RhythmKind.VentricularTrigeminy => new HashSet<string> { "couplingFraction", "morphology" },
        RhythmKind.SecondDegreeAvBlock => new HashSet<string> { "conductionRatio" },
        RhythmKind.BroadComplexTachycardia => new HashSet<string> { "avDissociation", "atrialRateBpm", "endPauseS", "morphology" },
        _ => new HashSet<string>(),
    };

    public static readonly string[] EctopicPShapes = ["inverted", "biphasic", "narrow-upright", "peaked"];
    public static readonly string[] VentricularShapes = ["ventricular-a", "ventricular-b"];
    public static readonly string[] FlutterConduction = ["2:1", "3:1", "4:1", "variable"];
}
