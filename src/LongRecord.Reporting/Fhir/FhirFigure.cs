namespace LongRecord.Reporting.Fhir;

/// <summary>
/// One figure exported as an Observation: its summary.json key (also its code in our own code system), a display
/// name, a UCUM unit, and a LOINC code where one is known to fit.
/// </summary>
/// <param name="Loinc">LOINC code and display, or null when we know of none for exactly this figure.</param>
public sealed record FhirFigure(string Key, string Display, double? Value, string UcumCode, string UnitText, (string Code, string Display)? Loinc);
