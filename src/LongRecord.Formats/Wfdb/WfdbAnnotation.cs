namespace LongRecord.Formats.Wfdb;

/// <summary>
/// One annotation of a WFDB annotation file (annotation(5), MIT format).
/// </summary>
/// <param name="Sample">Sample number (frame number) from the start of the record.</param>
/// <param name="Code">Annotation code.</param>
/// <param name="Subtype">The <c>subtyp</c> field (0 unless a SUB word gives it).</param>
/// <param name="Channel">The <c>chan</c> field (carries over to later annotations until changed).</param>
/// <param name="Number">The <c>num</c> field (carries over to later annotations until changed).</param>
/// <param name="Aux">Auxiliary text up to its first NUL (for example the rhythm <c>(AFIB</c>), or null when none.</param>
public readonly record struct WfdbAnnotation(long Sample, WfdbAnnotationCode Code, sbyte Subtype = 0, byte Channel = 0, byte Number = 0, string? Aux = null)
{
    /// <summary>True for an ANSI/AAMI EC57 beat label.</summary>
    public bool IsBeat => WfdbAnnotationCodes.IsBeat(Code);

    /// <summary>The code's mnemonic, or the code number in brackets when it has none.</summary>
    public string Mnemonic => WfdbAnnotationCodes.Mnemonic(Code) ?? $"[{(int)Code}]";

    /// <summary>
    /// The rhythm a rhythm-change annotation starts, as its AUX text writes it (for example <c>(AFIB</c>, <c>(N</c>,
    /// <c>(VT</c>); null for other annotations.
    /// </summary>
    public string? RhythmText =>
        Code == WfdbAnnotationCode.RhythmChange && Aux is { Length: > 1 } a && a[0] == '(' ? a : null;
}
