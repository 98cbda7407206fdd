namespace LongRecord.Formats.Edf;

/// <summary>How the data records of a file lie in time.</summary>
internal enum EdfVariant
{
    /// <summary>Original EDF (1992) or plain BDF: contiguous records, no EDF+ semantics required.</summary>
    Plain,

    /// <summary>EDF+C / BDF+C: contiguous records with time-keeping TALs.</summary>
    Continuous,

    /// <summary>EDF+D / BDF+D: each record's start is given by its time-keeping TAL; gaps allowed.</summary>
    Discontinuous,
}

/// <summary>The checked header record of an EDF, EDF+ or BDF file.</summary>
internal sealed class EdfHeader
{
    public required bool IsBdf { get; init; }
    public required EdfVariant Variant { get; init; }
    public required string PatientField { get; init; }
    public required string RecordingField { get; init; }

    /// <summary>Start date: the EDF+ "Startdate" subfield when valid, else the header's dd.mm.yy.</summary>
    public required DateOnly? StartDate { get; init; }

    /// <summary>The header's hh.mm.ss (whole seconds; the EDF+ sub-second part comes from the first time-keeping TAL).</summary>
    public required TimeOnly StartTime { get; init; }

    public required int HeaderBytes { get; init; }

    /// <summary>The record count field as written (−1 while recording, or when the writer did not know it).</summary>
    public required int DeclaredRecords { get; init; }

    public required double RecordDurationS { get; init; }
    public required IReadOnlyList<EdfSignalHeader> Signals { get; init; }
    public required int RecordBytes { get; init; }

    public int BytesPerSample => IsBdf ? 3 : 2;

    public bool IsPlus => Variant != EdfVariant.Plain;

    public string FormatDetail => (IsBdf ? "BDF" : "EDF") + Variant switch
    {
        EdfVariant.Continuous => "+C",
        EdfVariant.Discontinuous => "+D",
        _ => "",
    };
}
