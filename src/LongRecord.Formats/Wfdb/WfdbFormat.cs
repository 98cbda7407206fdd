namespace LongRecord.Formats.Wfdb;

/// <summary>
/// How one WFDB signal format packs samples (WFDB Applications Guide, signal(5)). Samples of a signal file form one
/// stream, frame after frame; a format stores that stream in groups of <see cref="SamplesPerGroup"/> samples in
/// <see cref="BytesPerGroup"/> bytes.
/// </summary>
internal sealed class WfdbFormat
{
    private static readonly int[] s_known = [0, 8, 16, 24, 32, 61, 80, 160, 212, 310, 311, 508, 516, 524];

    private static readonly WfdbFormat[] s_supported =
    [
        // Invalid-sample values: the lowest value of each format's sample width (bemoody/wfdb issue #11 says the WFDB
        // library treats the format minimum as invalid for formats narrower than 16 bits, and −32768 for 16 bits).
        // For 24 and 32 bits we take the format minimum as well; format 8 stores differences and has none.
        new(8, 1, 1, 8, null),
        new(16, 1, 2, 16, short.MinValue),
        new(24, 1, 3, 24, -(1 << 23)),
        new(32, 1, 4, 32, int.MinValue),
        new(61, 1, 2, 16, short.MinValue),
        new(80, 1, 1, 8, sbyte.MinValue),
        new(160, 1, 2, 16, short.MinValue),
        new(212, 2, 3, 12, -2048),
        new(310, 3, 4, 10, -512),
        new(311, 3, 4, 10, -512),
    ];

    private WfdbFormat(int code, int samplesPerGroup, int bytesPerGroup, int bits, int? invalidValue)
    {
        Code = code;
        SamplesPerGroup = samplesPerGroup;
        BytesPerGroup = bytesPerGroup;
        Bits = bits;
        InvalidValue = invalidValue;
    }

    public int Code { get; }

    public int SamplesPerGroup { get; }

    public int BytesPerGroup { get; }

    /// <summary>Bits of one stored sample (a difference for format 8).</summary>
    public int Bits { get; }

    /// <summary>The stored value that marks a missing sample, or null when the format has none.</summary>
    public int? InvalidValue { get; }

    /// <summary>True for the format codes header(5) and signal(5) define, read here or not.</summary>
    public static bool IsKnown(int code) => Array.IndexOf(s_known, code) >= 0;

    /// <summary>The formats this reader decodes; null for others (0, the FLAC formats 508/516/524, unknown codes).</summary>
    public static WfdbFormat? TryGet(int code)
    {
        foreach (var f in s_supported)
        {
            if (f.Code == code)
            {
                return f;
            }
        }

        return null;
    }

    /// <summary>
    /// Bytes that must be present to hold the first <paramref name="samples"/> samples of the stream. A bit-packed group
    /// may be cut short after its last needed sample, as WFDB writers do for an odd sample count.
    /// </summary>
    public long MinimumBytes(long samples)
    {
        var whole = samples / SamplesPerGroup * BytesPerGroup;
        var rest = (int)(samples % SamplesPerGroup);
        if (rest == 0)
        {
            return whole;
        }

        // 212: sample 0 of a pair lives in bytes 0–1. 310: samples 0 and 1 live in bytes 0–1 and 2–3 (sample 1 needs all
        // four). 311: sample 0 in bits 0–9 (bytes 0–1), sample 1 in bits 10–19 (bytes 1–2).
        return whole + (Code, rest) switch
        {
            (212, 1) => 2,
            (310, 1) => 2,
            (310, 2) => 4,
            (311, 1) => 2,
            (311, 2) => 3,
            _ => BytesPerGroup,
        };
    }

    /// <summary>Default ADC resolution when the header gives none (header(5): 12 bits, 10 for difference formats).</summary>
    public int DefaultResolutionBits => Code == 8 ? 10 : Math.Min(12, Bits);
}
