namespace LongRecord.Formats;

/// <summary>
/// Patient and recording identification exactly as the file writes them, plus the parts a format defines
/// (EDF+ subfields, ISHNE name fields). Fields the file does not hold are null.
/// </summary>
public sealed record Identification
{
    /// <summary>Raw patient field (EDF "local patient identification", WFDB comment lines, ISHNE names and ID).</summary>
    public string PatientField { get; init; } = "";

    /// <summary>Raw recording field (EDF "local recording identification", ISHNE recorder and proprietary text).</summary>
    public string RecordingField { get; init; } = "";

    public string? PatientName { get; init; }
    public string? PatientId { get; init; }
    public string? Sex { get; init; }
    public string? BirthDate { get; init; }
}
