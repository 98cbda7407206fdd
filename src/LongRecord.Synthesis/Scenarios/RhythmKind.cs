namespace LongRecord.Synthesis.Scenarios;

/// <summary>The rhythms a scenario segment can script. JSON names are in <see cref="RhythmNames"/>.</summary>
public enum RhythmKind
{
    Sinus,
    SinusBradycardia,
    SinusTachycardia,
    FocalAtrialTachycardia,
    Psvt,
    AtrialFlutter,
    AtrialFibrillation,
    MultifocalAtrialTachycardia,
    VentricularBigeminy,
    VentricularTrigeminy,
    SecondDegreeAvBlock,
    BroadComplexTachycardia,
    VentricularFlutter,
    VentricularFibrillation,
}

/// <summary>The JSON spelling of each <see cref="RhythmKind"/> (also used as the rhythm kind in truth files).</summary>
public static class RhythmNames
{
    private static readonly (RhythmKind Kind, string Name)[] s_names =
    [
        (RhythmKind.Sinus, "sinus"),
        (RhythmKind.SinusBradycardia, "sinus-bradycardia"),
        (RhythmKind.SinusTachycardia, "sinus-tachycardia"),
        (RhythmKind.FocalAtrialTachycardia, "focal-atrial-tachycardia"),
        (RhythmKind.Psvt, "psvt"),
        (RhythmKind.AtrialFlutter, "atrial-flutter"),
        (RhythmKind.AtrialFibrillation, "af"),
        (RhythmKind.MultifocalAtrialTachycardia, "mat"),
        (RhythmKind.VentricularBigeminy, "ventricular-bigeminy"),
        (RhythmKind.VentricularTrigeminy, "ventricular-trigeminy"),
        (RhythmKind.SecondDegreeAvBlock, "av-block-2"),
        (RhythmKind.BroadComplexTachycardia, "broad-complex-tachycardia"),
        (RhythmKind.VentricularFlutter, "ventricular-flutter"),
        (RhythmKind.VentricularFibrillation, "ventricular-fibrillation"),
    ];

    public static string Name(RhythmKind kind)
    {
        foreach (var (k, n) in s_names)
        {
            if (k == kind)
            {
                return n;
            }
        }

        throw new ArgumentOutOfRangeException(nameof(kind));
    }

    public static bool TryParse(string name, out RhythmKind kind)
    {
        foreach (var (k, n) in s_names)
        {
            if (n == name)
            {
                kind = k;
                return true;
            }
        }

        kind = default;
        return false;
    }

    public static IEnumerable<string> All => s_names.Select(p => p.Name);
}
