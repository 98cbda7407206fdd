namespace LongRecord.Synthesis.Truth;

/// <summary>
/// One annotation in the neutral list the integrator writes as a WFDB annotation file. <see cref="Code"/> uses the
/// MIT-BIH mnemonics (from memory): beats <c>N</c>, <c>A</c> (atrial premature, S-class beat with an ectopic P),
/// <c>S</c> (S-class beat without an ectopic P before it, such as PSVT), <c>V</c>; <c>x</c> non-conducted P wave;
/// <c>+</c> rhythm change with the label in <see cref="Aux"/>; <c>[</c> and <c>]</c> start and end of ventricular
/// flutter/fibrillation; <c>~</c> change in signal quality, with <see cref="NoisyLeadMask"/> (bit k = lead k noisy,
/// 0 = all clean) and the active noise kinds in <see cref="Aux"/>.
/// </summary>
public readonly record struct TruthAnnotation(long Sample, double TimeS, string Code, string? Aux = null, int NoisyLeadMask = 0);
