namespace LongRecord.Formats.Edf;

/// <summary>
/// The EDF+ identification subfields (Kemp and Olivan 2003, section 2.1.3.3 and 2.1.3.4): the patient field is
/// "code sex birthdate name …", the recording field "Startdate dd-MMM-yyyy admincode technician equipment …",
/// subfields separated by spaces, unknown ones written "X", spaces inside a subfield written as '_'.
/// </summary>
internal static class EdfIdentificationParser
{
    public static Identification Parse(string patientField, string recordingField, bool isPlus)
    {
        var id = new Identification { PatientField = patientField, RecordingField = recordingField };
        if (!isPlus)
        {
            return id;
        }

        var parts = patientField.Split(' ', StringSplitOptions.RemoveEmptyEntries);
        string? Part(int i) => i < parts.Length && parts[i] != "X" ? parts[i] : null;

        var sex = Part(1)?.ToUpperInvariant();
        var birth = Part(2);
        return id with
        {
            PatientId = Part(0),
            Sex = sex is "F" or "M" ? sex : null,
            // Normalised to ISO 8601 (yyyy-MM-dd) so every format reports birth dates alike; kept as written when unparsable.
            BirthDate = birth is null ? null : EdfDates.TryParsePlusDate(birth, out var d) ? d.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture) : birth,
            PatientName = Part(3)?.Replace('_', ' '),
        };
    }

    /// <summary>The "Startdate dd-MMM-yyyy" subfield of an EDF+ recording field, when present and valid.</summary>
    public static bool TryStartDate(string recordingField, out DateOnly date)
    {
        date = default;
        var parts = recordingField.Split(' ', StringSplitOptions.RemoveEmptyEntries);
        return parts.Length >= 2 && parts[0] == "Startdate" && EdfDates.TryParsePlusDate(parts[1], out date);
    }
}
