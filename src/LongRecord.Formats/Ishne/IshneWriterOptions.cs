namespace LongRecord.Formats.Ishne;

/// <summary>What <see cref="IshneWriter"/> puts in the header. Text fields are Latin-1 and must fit their fixed width.</summary>
public sealed record IshneWriterOptions
{
    /// <summary>The stored leads in storage order, 1 to 12.</summary>
    public required IReadOnlyList<IshneLead> Leads { get; init; }

    /// <summary>Samples per second per lead, 1–32 767 (the header holds a short).</summary>
    public required short SamplingRateHz { get; init; }

    /// <summary>Subject first name, up to 40 characters.</summary>
    public string FirstName { get; init; } = "";

    /// <summary>Subject last name, up to 40 characters.</summary>
    public string LastName { get; init; } = "";

    /// <summary>Subject ID, up to 20 characters.</summary>
    public string SubjectId { get; init; } = "";

    public IshneSex Sex { get; init; } = IshneSex.Unknown;

    /// <summary>Race code (0 unknown, 1 Caucasian, 2 Black, 3 Oriental).</summary>
    public short Race { get; init; }

    public DateOnly? BirthDate { get; init; }

    public DateOnly? RecordingDate { get; init; }

    public TimeOnly? StartTime { get; init; }

    /// <summary>Date written as the file's creation date; null writes today's date.</summary>
    public DateOnly? FileDate { get; init; }

    /// <summary>Pacemaker code (0 none, 1 unknown type, 2–5 chamber and polarity, see <see cref="IshneHeader.Pacemaker"/>).</summary>
    public short Pacemaker { get; init; }

    /// <summary>Type of recorder (analog or digital), up to 40 characters.</summary>
    public string RecorderType { get; init; } = "";

    /// <summary>Proprietary of the ECG, up to 80 characters.</summary>
    public string Proprietary { get; init; } = "";

    /// <summary>Copyright and restrictions of diffusion, up to 80 characters.</summary>
    public string Copyright { get; init; } = "";

    /// <summary>Free text of the variable-length block (read back as <see cref="RecordingInfo.Comments"/>, one per line).</summary>
    public string VariableBlockText { get; init; } = "";

    /// <summary>File version field. The paper gives no value list; 1 is this library's choice (no source).</summary>
    public short FileVersion { get; init; } = 1;
}
