namespace LongRecord.Formats.Wfdb;

/// <summary>
/// A parsed WFDB header (.hea) file: the record line, one <see cref="WfdbSignalSpec"/> per signal and the comment
/// lines (WFDB Applications Guide, header(5)). Multi-segment records are refused.
/// </summary>
public sealed record WfdbHeader
{
    /// <summary>Sampling frequency assumed when the record line gives none (header(5), DEFREQ).</summary>
    public const double DefaultSamplingFrequencyHz = 250.0;

    /// <summary>The header as the caller named it.</summary>
    public required string FilePath { get; init; }

    public required string RecordName { get; init; }

    /// <summary>Number of signals the record line declares (0 is legal: a record named only for its annotations).</summary>
    public required int SignalCount { get; init; }

    /// <summary>Samples per second per signal (frames per second when a signal has several samples per frame).</summary>
    public required double SamplingFrequencyHz { get; init; }

    /// <summary>Counter frequency in ticks per second, or null when absent.</summary>
    public double? CounterFrequencyHz { get; init; }

    /// <summary>Counter value at sample 0; 0 when absent.</summary>
    public double BaseCounterValue { get; init; }

    /// <summary>Number of samples (frames) per signal, or null when absent or zero (header(5): unspecified).</summary>
    public long? SamplesPerSignal { get; init; }

    /// <summary>Time of day of sample 0 as recorded, or null when absent.</summary>
    public TimeOnly? BaseTime { get; init; }

    /// <summary>Date of sample 0 as recorded, or null when absent (or written as the placeholder 0/0/0).</summary>
    public DateOnly? BaseDate { get; init; }

    /// <summary>The first <see cref="SignalCount"/> signal specification lines, in order.</summary>
    public required IReadOnlyList<WfdbSignalSpec> Signals { get; init; }

    /// <summary>Text of every comment line after its <c>#</c>, in file order.</summary>
    public IReadOnlyList<string> Comments { get; init; } = [];

    /// <summary>Comment lines after the last signal line (header(5) "info strings"), text after the <c>#</c>.</summary>
    public IReadOnlyList<string> InfoStrings { get; init; } = [];

    /// <summary>Byte offset of the number-of-samples field in the header (or of the record line's end when absent).</summary>
    public long SamplesPerSignalByteOffset { get; init; }

    /// <summary>Reads and parses the header file at <paramref name="path"/>.</summary>
    /// <exception cref="RecordingFormatException">The file is missing or is not a valid single-segment header.</exception>
    public static WfdbHeader Parse(string path) => WfdbHeaderParser.ParseFile(path);

    /// <summary>
    /// Parses header text. Offsets in errors count characters of <paramref name="text"/>, which equal bytes for the
    /// ASCII text headers hold. <paramref name="filePath"/> names the header in errors and resolves signal files.
    /// </summary>
    public static WfdbHeader ParseText(string text, string filePath) => WfdbHeaderParser.Parse(text, filePath);
}
