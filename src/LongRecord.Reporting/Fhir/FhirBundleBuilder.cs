using System.Globalization;
using System.Text.Json;
using Hl7.Fhir.Model;
using Hl7.Fhir.Serialization;
using LongRecord.Reporting.Model;

namespace LongRecord.Reporting.Fhir;

/// <summary>
/// The report as an HL7 FHIR R4 bundle for hospital record systems: a DiagnosticReport (preliminary: not yet
/// reviewed) whose results are one Observation per figure, each with the value and UCUM unit of summary.json, and the
/// Patient (only the pseudonym when de-identified).
/// </summary>
public static class FhirBundleBuilder
{
    /// <summary>Our own code system for figures: the code is the summary.json key.</summary>
    public const string FigureSystem = "urn:longrecord:summary-figure";

    /// <summary>Identifier system of de-identified patients' pseudonyms.</summary>
    public const string PseudonymSystem = "urn:longrecord:pseudonym";

    public const string LoincSystem = "http://loinc.org";
    public const string UcumSystem = "http://unitsofmeasure.org";

    public static JsonSerializerOptions JsonOptions { get; } = new JsonSerializerOptions().ForFhir(ModelInfo.ModelInspector).Pretty();

    /// <summary>The figures exported, in order.</summary>
    public static IReadOnlyList<FhirFigure> Figures(ReportFigures f)
    {
        int? Beats(string c) => f.BeatsByClass.Where(kv => kv.Key == c).Select(kv => (int?)kv.Value).FirstOrDefault();
        // LOINC 8867-4 "Heart rate" and 80404-7 "R-R interval.standard deviation (Heart rate variability)": from memory.
        return
        [
            new("total_beats", "Beats in the recording", f.TotalBeats, "{beats}", "beats", null),
            new("analysable_percent", "Analysable share of the recording", f.AnalysablePercent, "%", "%", null),
            new("hr_mean_bpm", "Mean heart rate over the analysable recording", f.HrMeanBpm, "/min", "bpm", ("8867-4", "Heart rate")),
            new("hr_min_bpm", "Lowest heart rate (8-beat average)", f.HrMinBpm, "/min", "bpm", null),
            new("hr_max_bpm", "Highest heart rate (8-beat average)", f.HrMaxBpm, "/min", "bpm", null),
            new("af_burden_percent", "AF burden (AF time over analysable time)", f.AfBurdenPercent, "%", "%", null),
            new("af_episode_count", "AF episodes", f.AfEpisodeCount, "{episodes}", "episodes", null),
            new("af_longest_s", "Longest AF episode", f.AfLongestS, "s", "s", null),
            new("pause_count", "Pauses", f.PauseCount, "{pauses}", "pauses", null),
            new("pause_longest_s", "Longest pause", f.PauseLongestS, "s", "s", null),
            new("bradycardia_count", "Bradycardia episodes", f.BradycardiaCount, "{episodes}", "episodes", null),
            new("beats_s", "Supraventricular ectopic beats", Beats("S"), "{beats}", "beats", null),
            new("beats_v", "Ventricular ectopic beats", Beats("V"), "{beats}", "beats", null),
            new("sdnn_ms", "SDNN", f.SdnnMs, "ms", "ms", ("80404-7", "R-R interval.standard deviation (Heart rate variability)")),
            new("sdann_ms", "SDANN", f.SdannMs, "ms", "ms", null),
            new("rmssd_ms", "RMSSD", f.RmssdMs, "ms", "ms", null),
            new("pnn50_percent", "pNN50", f.Pnn50Percent, "%", "%", null),
        ];
    }

    public static Bundle Build(ReportModel model, DateTimeOffset issued)
    {
        var patient = Patient(model.Patient);
        var patientUrl = Urn();
        var subject = new ResourceReference(patientUrl);
        var bundle = new Bundle { Type = Bundle.BundleType.Collection, Timestamp = issued };
        bundle.Entry.Add(new Bundle.EntryComponent { FullUrl = patientUrl, Resource = patient });
        var report = new DiagnosticReport
        {
            Status = DiagnosticReport.DiagnosticReportStatus.Preliminary,
            // HL7 v2 table 0074 "EC" (electrocardiac) and LOINC 11524-6 "EKG study": from memory.
            Category = [new CodeableConcept("http://terminology.hl7.org/CodeSystem/v2-0074", "EC", "Electrocardiac")],
            Code = new CodeableConcept(LoincSystem, "11524-6", "EKG study", "Ambulatory ECG, automated analysis"),
            Subject = subject,
            Effective = Period(model.Recording),
            Issued = issued,
            Conclusion = "Automated analysis, not yet reviewed: every finding must be confirmed by qualified staff.",
        };
        foreach (var f in Figures(model.Figures))
        {
            var url = Urn();
            bundle.Entry.Add(new Bundle.EntryComponent { FullUrl = url, Resource = Observation(f, subject, model.Recording) });
            report.Result.Add(new ResourceReference(url));
        }

        bundle.Entry.Insert(1, new Bundle.EntryComponent { FullUrl = Urn(), Resource = report });
        return bundle;
    }

    public static string ToJson(Bundle bundle) => JsonSerializer.Serialize(bundle, JsonOptions);

    /// <summary>Writes the bundle under a temporary name and renames it when complete.</summary>
    public static void Write(string path, ReportModel model, DateTimeOffset issued)
    {
        var full = Path.GetFullPath(path);
        var temp = Path.Combine(Path.GetDirectoryName(full)!, $".{Path.GetFileName(full)}.partial-{Guid.NewGuid():N}");
        File.WriteAllText(temp, ToJson(Build(model, issued)));
        File.Move(temp, full, overwrite: true);
    }

    private static Observation Observation(FhirFigure f, ResourceReference subject, ReportRecording recording)
    {
        var code = new CodeableConcept { Text = f.Display };
        code.Coding.Add(new Coding(FigureSystem, f.Key, f.Display));
        if (f.Loinc is var (loinc, display))
        {
            code.Coding.Add(new Coding(LoincSystem, loinc, display));
        }

        var o = new Observation
        {
            Status = ObservationStatus.Preliminary,
            Category = [new CodeableConcept("http://terminology.hl7.org/CodeSystem/observation-category", "procedure", "Procedure")],
            Code = code,
            Subject = subject,
            Effective = Period(recording),
        };
        if (f.Value is double v)
        {
            o.Value = new Quantity { Value = (decimal)v, Unit = f.UnitText, System = UcumSystem, Code = f.UcumCode };
        }
        else
        {
            o.DataAbsentReason = new CodeableConcept("http://terminology.hl7.org/CodeSystem/data-absent-reason", "not-applicable", "Not Applicable");
        }

        return o;
    }

    private static Patient Patient(ReportPatient p)
    {
        var patient = new Patient();
        if (p.Deidentified)
        {
            patient.Identifier.Add(new Identifier(PseudonymSystem, p.Pseudonym));
            return patient;
        }

        if (!string.IsNullOrWhiteSpace(p.Id))
        {
            patient.Identifier.Add(new Identifier { Value = p.Id });
        }

        if (!string.IsNullOrWhiteSpace(p.Name))
        {
            patient.Name.Add(new HumanName { Text = p.Name });
        }

        if (DateOnly.TryParseExact(p.BirthDate, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var birth))
        {
            patient.BirthDate = birth.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);
        }

        patient.Gender = p.Sex?.ToUpperInvariant() switch
        {
            "F" => AdministrativeGender.Female,
            "M" => AdministrativeGender.Male,
            _ => null,
        };
        return patient;
    }

    // Times as recorded carry no time zone, and a FHIR dateTime with a time must have one (R4 §2.24.0.1, dateTime):
    // the period is given to the day, which needs none.
    private static Period? Period(ReportRecording r) => r.Start is DateTime t
        ? new Period(new FhirDateTime(t.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture)),
            new FhirDateTime(t.AddSeconds(r.DurationS).ToString("yyyy-MM-dd", CultureInfo.InvariantCulture)))
        : null;

    private static string Urn() => $"urn:uuid:{Guid.NewGuid()}";
}
