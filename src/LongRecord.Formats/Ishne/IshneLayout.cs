namespace LongRecord.Formats.Ishne;

/// <summary>
/// Byte offsets of the ISHNE 1.0 header (Badilini 1998, Table 3), counted from the start of the file.
/// Integers are little-endian; "short" is 16-bit and "long" 32-bit, both signed.
/// </summary>
internal static class IshneLayout
{
    public const int MagicOffset = 0;
    public const int MagicLength = 8;
    public const int ChecksumOffset = 8;

    // The checksum covers everything from here up to the ECG block (Appendix B).
    public const int ChecksumStart = 10;

    public const int VariableBlockSizeOffset = 10;
    public const int SamplesPerLeadOffset = 14;
    public const int VariableBlockOffsetOffset = 18;
    public const int EcgOffsetOffset = 22;
    public const int FileVersionOffset = 26;
    public const int FirstNameOffset = 28;
    public const int LastNameOffset = 68;
    public const int SubjectIdOffset = 108;
    public const int SexOffset = 128;
    public const int RaceOffset = 130;
    public const int BirthDateOffset = 132;
    public const int RecordingDateOffset = 138;
    public const int FileDateOffset = 144;
    public const int StartTimeOffset = 150;
    public const int LeadCountOffset = 156;
    public const int LeadSpecOffset = 158;
    public const int LeadQualityOffset = 182;
    public const int ResolutionOffset = 206;
    public const int PacemakerOffset = 230;
    public const int RecorderOffset = 232;
    public const int SamplingRateOffset = 272;
    public const int ProprietaryOffset = 274;
    public const int CopyrightOffset = 354;
    public const int ReservedOffset = 434;

    public const int NameLength = 40;
    public const int SubjectIdLength = 20;
    public const int RecorderLength = 40;
    public const int ProprietaryLength = 80;
    public const int CopyrightLength = 80;
    public const int ReservedLength = 88;

    /// <summary>Size of the fixed-length block (bytes 10–521).</summary>
    public const int FixedBlockLength = 512;

    /// <summary>Where the variable-length block starts: magic (8) + checksum (2) + fixed block (512).</summary>
    public const int VariableBlockStart = 522;

    /// <summary>Lead slots in the header arrays (12 × short).</summary>
    public const int MaxLeads = 12;

    /// <summary>Marks an absent lead slot or an unknown date or time part.</summary>
    public const short Absent = -9;

    /// <summary>
    /// Sample value read as "no value". The paper says some groups proposed a reserved value such as −32 768 to mark
    /// lead fault; this reader adopts it.
    /// </summary>
    public const short LeadFault = short.MinValue;

    // Not part of the standard: a bound that keeps a corrupt size field from making the reader allocate gigabytes.
    // Free-text blocks in practice are a few kilobytes (common practice, no source).
    public const int MaxVariableBlockBytes = 16 * 1024 * 1024;

    public static ReadOnlySpan<byte> Magic => "ISHNE1.0"u8;
}
