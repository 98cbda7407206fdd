using System.Text.Json.Serialization;

namespace LongRecord.Pipeline.Privacy;

/// <summary>One line of the mapping kept in the key file.</summary>
public sealed class PseudonymEntry
{
    [JsonPropertyName("pseudonym")]
    public string Pseudonym { get; set; } = "";

    [JsonPropertyName("relative_path")]
    public string RelativePath { get; set; } = "";

    [JsonPropertyName("patient_name")]
    public string? PatientName { get; set; }

    [JsonPropertyName("patient_id")]
    public string? PatientId { get; set; }

    [JsonPropertyName("birth_date")]
    public string? BirthDate { get; set; }
}
