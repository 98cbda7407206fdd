namespace LongRecord.Reporting.Model;

/// <summary>
/// Patient fields as the recording gives them, or, when de-identified, only the pseudonym (name, ID and birth date
/// never reach the model then).
/// </summary>
public sealed record ReportPatient
{
    public string? Name { get; init; }

    public string? Id { get; init; }

    public string? BirthDate { get; init; }

    public string? Sex { get; init; }

    /// <summary>Set when the report is de-identified: the stable pseudonym that stands for the patient.</summary>
    public string? Pseudonym { get; init; }

    public bool Deidentified => Pseudonym is not null;
}
