namespace LongRecord.Formats.Edf;

/// <summary>One signal's header fields as parsed and checked, plus where its samples sit inside a data record.</summary>
internal sealed record EdfSignalHeader
{
    /// <summary>0-based position in the header (messages print it 1-based).</summary>
    public required int Index { get; init; }

    public required string Label { get; init; }
    public required string Transducer { get; init; }
    public required string PhysicalUnit { get; init; }
    public required double PhysicalMin { get; init; }
    public required double PhysicalMax { get; init; }
    public required int DigitalMin { get; init; }
    public required int DigitalMax { get; init; }
    public required string Prefilter { get; init; }
    public required int SamplesPerRecord { get; init; }

    /// <summary>Byte offset of this signal's first sample inside a data record.</summary>
    public required int OffsetInRecord { get; init; }

    /// <summary>True for an "EDF Annotations" / "BDF Annotations" signal, which holds TALs instead of samples.</summary>
    public required bool IsAnnotation { get; init; }

    /// <summary>Digital units per physical unit (EDF: the linear map from digital min/max to physical min/max).</summary>
    public double Gain => ((double)DigitalMax - DigitalMin) / (PhysicalMax - PhysicalMin);

    /// <summary>Digital value of physical zero.</summary>
    public double Baseline => DigitalMin - PhysicalMin * Gain;
}
