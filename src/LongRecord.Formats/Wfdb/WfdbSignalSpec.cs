namespace LongRecord.Formats.Wfdb;

/// <summary>
/// One signal specification line of a WFDB header, fields as written (WFDB Applications Guide, header(5),
/// "Signal specification lines"). Optional fields the line leaves out hold their header(5) defaults.
/// </summary>
public sealed record WfdbSignalSpec
{
    /// <summary>Default ADC gain when the field is zero or absent: 200 ADC units per physical unit (header(5), DEFGAIN).</summary>
    public const double DefaultGain = 200.0;

    /// <summary>Signal file name as written (may hold a path; <c>-</c> means standard input).</summary>
    public required string FileName { get; init; }

    /// <summary>Storage format code (signal(5)), for example 212.</summary>
    public required int Format { get; init; }

    /// <summary>Samples of this signal in each frame (the <c>x</c> modifier); 1 when absent.</summary>
    public int SamplesPerFrame { get; init; } = 1;

    /// <summary>Samples of this signal that precede sample 0 (the <c>:</c> modifier); 0 when absent.</summary>
    public int Skew { get; init; }

    /// <summary>Bytes before sample 0 in the signal file (the <c>+</c> modifier); 0 when absent.</summary>
    public long ByteOffset { get; init; }

    /// <summary>ADC gain as written, in ADC units per physical unit; 0 when absent or uncalibrated.</summary>
    public double AdcGain { get; init; }

    /// <summary>Baseline as written (the <c>(…)</c> after the gain), or null when absent.</summary>
    public int? Baseline { get; init; }

    /// <summary>Physical unit as written (the <c>/…</c> after the gain), or null when absent (header(5): millivolts).</summary>
    public string? Units { get; init; }

    /// <summary>ADC resolution in bits as written; 0 when absent.</summary>
    public int AdcResolution { get; init; }

    /// <summary>ADC zero; 0 when absent.</summary>
    public int AdcZero { get; init; }

    /// <summary>Initial value as written, or null when absent (header(5): then equal to the ADC zero).</summary>
    public int? InitialValue { get; init; }

    /// <summary>16-bit checksum of the signal's samples as written, or null when absent.</summary>
    public int? Checksum { get; init; }

    /// <summary>Block size in bytes; 0 when absent.</summary>
    public int BlockSize { get; init; }

    /// <summary>Description (rest of the line, may contain spaces), or null when absent.</summary>
    public string? Description { get; init; }

    /// <summary>1-based line number in the header file.</summary>
    public int LineNumber { get; init; }

    /// <summary>Byte offset of the line in the header file.</summary>
    public long LineByteOffset { get; init; }

    /// <summary>Gain used for conversion: <see cref="AdcGain"/>, or <see cref="DefaultGain"/> when that is zero.</summary>
    public double EffectiveGain => AdcGain == 0 ? DefaultGain : AdcGain;

    /// <summary>Baseline used for conversion: <see cref="Baseline"/>, or the ADC zero when absent (header(5)).</summary>
    public int EffectiveBaseline => Baseline ?? AdcZero;

    /// <summary>Value of sample 0 for difference formats: <see cref="InitialValue"/>, or the ADC zero when absent.</summary>
    public int EffectiveInitialValue => InitialValue ?? AdcZero;
}
