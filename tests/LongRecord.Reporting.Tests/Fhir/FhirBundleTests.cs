using System.Globalization;
using System.Text.Json;
using Hl7.Fhir.Model;
using Hl7.Fhir.Serialization;
using LongRecord.Reporting.Fhir;
using LongRecord.Reporting.Tests.Support;

namespace LongRecord.Reporting.Tests.Fhir;

/// <summary>
/// The FHIR bundle beside the report, parsed by the Hl7.Fhir.R4 parser (Firely SDK) and compared with summary.json.
/// Required elements from the FHIR R4 resource definitions: Bundle.type; DiagnosticReport.status and .code;
/// Observation.status and .code (each 1..1).
/// </summary>
public sealed class FhirBundleTests(SummarisedDemo demo) : IClassFixture<SummarisedDemo>
{
    private static readonly JsonSerializerOptions s_parser = new JsonSerializerOptions().ForFhir(ModelInfo.ModelInspector);

    [Fact]
    public void Bundle_ParsesWithTheR4Parser_AndCarriesTheRequiredElements()
    {
        var bundle = Parse();
        Assert.NotNull(bundle.Type);
        var report = Assert.Single(bundle.Entry.Select(e => e.Resource).OfType<DiagnosticReport>());
        Assert.NotNull(report.Status);
        Assert.NotNull(report.Code);
        Assert.Equal(DiagnosticReport.DiagnosticReportStatus.Preliminary, report.Status);
        var observations = bundle.Entry.Select(e => e.Resource).OfType<Observation>().ToArray();
        Assert.NotEmpty(observations);
        Assert.All(observations, o =>
        {
            Assert.NotNull(o.Status);
            Assert.NotEmpty(o.Code.Coding);
        });
        // Every result reference points at an entry of the bundle.
        var urls = bundle.Entry.Select(e => e.FullUrl).ToHashSet();
        Assert.All(report.Result, r => Assert.Contains(r.Reference, urls));
        Assert.Equal(observations.Length, report.Result.Count);
    }

    [Fact]
    public void EveryObservation_HasTheValueOfSummaryJson_InTheUcumUnitItsKeyNames()
    {
        var summary = demo.Summary.RootElement;
        var observations = Parse().Entry.Select(e => e.Resource).OfType<Observation>().ToArray();
        foreach (var o in observations)
        {
            var key = o.Code.Coding.Single(c => c.System == FhirBundleBuilder.FigureSystem).Code!;
            var expected = summary.GetProperty(key);
            if (expected.ValueKind == JsonValueKind.Null)
            {
                Assert.Null(o.Value);
                Assert.NotNull(o.DataAbsentReason);
                continue;
            }

            var q = Assert.IsType<Quantity>(o.Value);
            Assert.Equal("http://unitsofmeasure.org", q.System);
            Assert.Equal(expected.GetDecimal(), q.Value);
            // summary.json names each key's unit (README): _bpm per minute, _percent, _s, _ms; beats_<class> and the
            // rest are counts.
            var ucum = key.StartsWith("beats_", StringComparison.Ordinal) ? null
                : key.EndsWith("_bpm", StringComparison.Ordinal) ? "/min"
                : key.EndsWith("_percent", StringComparison.Ordinal) ? "%"
                : key.EndsWith("_ms", StringComparison.Ordinal) ? "ms"
                : key.EndsWith("_s", StringComparison.Ordinal) ? "s"
                : null;
            if (ucum is null)
            {
                // UCUM annotations in braces are unit 1 (UCUM §2.1, curly braces): a count.
                Assert.Matches(@"^\{[a-z]+\}$", q.Code);
            }
            else
            {
                Assert.Equal(ucum, q.Code);
            }
        }

        // The figures the report issue names are all there.
        var keys = observations.Select(o => o.Code.Coding.Single(c => c.System == FhirBundleBuilder.FigureSystem).Code!).ToHashSet();
        Assert.Superset(new HashSet<string> { "hr_mean_bpm", "hr_min_bpm", "hr_max_bpm", "af_burden_percent", "pause_count", "total_beats" }, keys);
    }

    [Fact]
    public void MeanHeartRate_CarriesLoinc8867_4()
    {
        // LOINC 8867-4 "Heart rate" (from memory).
        var mean = Parse().Entry.Select(e => e.Resource).OfType<Observation>()
            .Single(o => o.Code.Coding.Any(c => c.System == FhirBundleBuilder.FigureSystem && c.Code == "hr_mean_bpm"));
        Assert.Contains(mean.Code.Coding, c => c.System == "http://loinc.org" && c.Code == "8867-4");
        Assert.Equal(demo.Summary.RootElement.GetProperty("hr_mean_bpm").GetDouble().ToString(CultureInfo.InvariantCulture),
            Assert.IsType<Quantity>(mean.Value).Value!.Value.ToString(CultureInfo.InvariantCulture));
    }

    private Bundle Parse() => JsonSerializer.Deserialize<Bundle>(File.ReadAllText(demo.Fhir), s_parser)!;
}
