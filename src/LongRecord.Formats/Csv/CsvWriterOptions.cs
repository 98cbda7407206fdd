namespace LongRecord.Formats.Csv;

/// <summary>What <see cref="CsvRecordingWriter"/> writes.</summary>
public sealed record CsvWriterOptions
{
    public required IReadOnlyList<CsvLead> Leads { get; init; }

    /// <summary>Samples per second, positive.</summary>
    public required double SamplingRateHz { get; init; }

    public CsvTimeFormat TimeFormat { get; init; } = CsvTimeFormat.Seconds;

    /// <summary>
    /// Clock time of the first sample. Required for <see cref="CsvTimeFormat.IsoDateTime"/>; with seconds it is written as a
    /// <c># start:</c> comment line.
    /// </summary>
    public DateTime? Start { get; init; }

    /// <summary>Comment lines written before the header, each after <c># </c>.</summary>
    public IReadOnlyList<string> Comments { get; init; } = [];
}
