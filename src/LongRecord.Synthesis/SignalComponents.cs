namespace LongRecord.Synthesis;

/// <summary>Which parts of the signal a render includes. Rendering with <see cref="Ecg"/> alone gives the clean signal.</summary>
[Flags]
public enum SignalComponents
{
    /// <summary>Beats (P, QRS, T), flutter/fibrillatory waves, ventricular flutter and fibrillation.</summary>
    Ecg = 1,

    /// <summary>The scenario's low-level background baseline wander and muscle noise (not a truth noise stretch).</summary>
    BackgroundNoise = 2,

    /// <summary>The scripted noise stretches, lead-off included.</summary>
    NoiseStretches = 4,

    All = Ecg | BackgroundNoise | NoiseStretches,
}
