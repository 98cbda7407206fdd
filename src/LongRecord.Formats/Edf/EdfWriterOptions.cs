namespace LongRecord.Formats.Edf;

/// <summary>What <see cref="EdfWriter"/> writes: the channels, the data-record layout and the EDF+ identification.</summary>
public sealed record EdfWriterOptions
{
    /// <summary>The ordinary signals, in file order; the writer adds the annotation signal after them.</summary>
    public required IReadOnlyList<EdfWriterChannel> Channels { get; init; }

    /// <summary>Duration of a data record in seconds (default 1); must be positive and is written in at most 8 characters.</summary>
    public double RecordDurationS { get; init; } = 1;

    /// <summary>
    /// Device-local time of the first sample, 1985 or later. The header holds whole seconds; a fraction of a second is
    /// written as the onset of the first time-keeping TAL (EDF+ 2.2.4), with 100 ns resolution.
    /// </summary>
    public required DateTime Start { get; init; }

    /// <summary>EDF+ patient code (hospital administration code); null writes "X" (unknown).</summary>
    public string? PatientCode { get; init; }

    /// <summary>"F" or "M"; null writes "X".</summary>
    public string? PatientSex { get; init; }

    /// <summary>Birth date, written dd-MMM-yyyy; null writes "X".</summary>
    public DateOnly? PatientBirthDate { get; init; }

    /// <summary>Patient name; spaces are written as '_' (EDF+ 2.1.3.3).</summary>
    public string? PatientName { get; init; }

    /// <summary>EDF+ recording field: hospital administration code of the investigation.</summary>
    public string? AdminCode { get; init; }

    /// <summary>EDF+ recording field: code or name of the technician.</summary>
    public string? Technician { get; init; }

    /// <summary>EDF+ recording field: code or name of the equipment.</summary>
    public string? Equipment { get; init; }

    /// <summary>Write BDF+C (24-bit samples, 0xFF "BIOSEMI") instead of EDF+C.</summary>
    public bool Bdf { get; init; }

    /// <summary>
    /// Bytes of each data record reserved for the annotation signal (rounded up to whole 2- or 3-byte samples). The
    /// time-keeping TAL takes up to 21 of them; annotations that do not fit spill into later records.
    /// </summary>
    public int AnnotationBytesPerRecord { get; init; } = 128;
}
