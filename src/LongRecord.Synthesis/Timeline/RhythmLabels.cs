using LongRecord.Synthesis.Scenarios;

namespace LongRecord.Synthesis.Timeline;

/// <summary>
/// Rhythm labels as the MIT-BIH Arrhythmia Database writes them in rhythm annotations (from memory: "(N", "(SBR",
/// "(AFIB", "(AFL", "(SVTA", "(VT", "(B", "(T", "(BII", "(VFL"; "(VF" is the ventricular fibrillation label of the
/// MIT-BIH Malignant Ventricular Arrhythmia Database). Sinus tachycardia has no label of its own there and is "(N";
/// focal, multifocal and re-entrant atrial tachycardias share "(SVTA". The truth file keeps the exact kind.
/// </summary>
internal static class RhythmLabels
{
    public const byte None = 0;

    private static readonly string?[] s_text = [null, "(N", "(SBR", "(AFIB", "(AFL", "(SVTA", "(VT", "(B", "(T", "(BII", "(VFL", "(VF"];

    public const byte Normal = 1;
    public const byte Bradycardia = 2;
    public const byte AtrialFibrillation = 3;
    public const byte AtrialFlutter = 4;
    public const byte Svta = 5;
    public const byte VentricularTachycardia = 6;
    public const byte Bigeminy = 7;
    public const byte Trigeminy = 8;
    public const byte SecondDegreeBlock = 9;
    public const byte VentricularFlutter = 10;
    public const byte VentricularFibrillation = 11;

    public static string? Text(byte code) => s_text[code];

    public static byte For(RhythmKind kind) => kind switch
    {
        RhythmKind.Sinus or RhythmKind.SinusTachycardia => Normal,
        RhythmKind.SinusBradycardia => Bradycardia,
        RhythmKind.FocalAtrialTachycardia or RhythmKind.Psvt or RhythmKind.MultifocalAtrialTachycardia => Svta,
        RhythmKind.AtrialFlutter => AtrialFlutter,
        RhythmKind.AtrialFibrillation => AtrialFibrillation,
        RhythmKind.VentricularBigeminy => Bigeminy,
        RhythmKind.VentricularTrigeminy => Trigeminy,
        RhythmKind.SecondDegreeAvBlock => SecondDegreeBlock,
        RhythmKind.BroadComplexTachycardia => VentricularTachycardia,
        RhythmKind.VentricularFlutter => VentricularFlutter,
        _ => VentricularFibrillation,
    };
}
