namespace LongRecord.Formats;

/// <summary>The file formats LongRecord reads.</summary>
public enum RecordingFormat
{
    /// <summary>European Data Format, 16-bit (EDF, EDF+C, EDF+D).</summary>
    Edf,

    /// <summary>BioSemi's 24-bit variant of EDF (BDF, BDF+).</summary>
    Bdf,

    /// <summary>PhysioNet WFDB record: a header plus signal files.</summary>
    Wfdb,

    /// <summary>ISHNE Holter standard output file, version 1.0.</summary>
    Ishne,

    /// <summary>Comma-separated text: a time column plus one column per lead.</summary>
    Csv,
}
