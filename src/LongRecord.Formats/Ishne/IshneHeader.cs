namespace LongRecord.Formats.Ishne;

/// <summary>
/// The ISHNE 1.0 header as stored (Badilini 1998, Table 3), after validation. Dates and the start time are null when the
/// file marks them unknown (−9, or 0 for a date part).
/// </summary>
public sealed record IshneHeader
{
    public required int VariableBlockSize { get; init; }

    public required int SamplesPerLead { get; init; }

    /// <summary>Byte offset of the variable-length block (always 522 in a valid file).</summary>
    public required int VariableBlockOffset { get; init; }

    /// <summary>Byte offset of the first sample.</summary>
    public required int EcgOffset { get; init; }

    public required short FileVersion { get; init; }

    public required string FirstName { get; init; }

    public required string LastName { get; init; }

    public required string SubjectId { get; init; }

    public required IshneSex Sex { get; init; }

    /// <summary>Race code: 0 unknown, 1 Caucasian, 2 Black, 3 Oriental, 4–9 reserved.</summary>
    public required short Race { get; init; }

    public required DateOnly? BirthDate { get; init; }

    public required DateOnly? RecordingDate { get; init; }

    public required DateOnly? FileDate { get; init; }

    public required TimeOnly? StartTime { get; init; }

    /// <summary>The stored leads, in storage order.</summary>
    public required IReadOnlyList<IshneLead> Leads { get; init; }

    /// <summary>
    /// Pacemaker code: 0 none, 1 unknown type, 2 single-chamber unipolar, 3 dual-chamber unipolar, 4 single-chamber bipolar,
    /// 5 dual-chamber bipolar.
    /// </summary>
    public required short Pacemaker { get; init; }

    public required string RecorderType { get; init; }

    public required short SamplingRateHz { get; init; }

    public required string Proprietary { get; init; }

    public required string Copyright { get; init; }

    /// <summary>Text of the variable-length block, NUL padding removed.</summary>
    public required string VariableBlockText { get; init; }

    /// <summary>Checksum as the file stores it.</summary>
    public required ushort Checksum { get; init; }

    /// <summary>True when the file stores the checksum high byte first (this library writes it low byte first).</summary>
    public required bool ChecksumBigEndian { get; init; }
}
