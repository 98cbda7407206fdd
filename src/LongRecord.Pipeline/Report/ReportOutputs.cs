using LongRecord.Formats;
using LongRecord.Pipeline.Channels;
using LongRecord.Pipeline.Inputs;
using LongRecord.Pipeline.Outputs;
using LongRecord.Reporting;
using LongRecord.Reporting.Fhir;
using LongRecord.Reporting.Model;

namespace LongRecord.Pipeline.Report;

/// <summary>
/// Writes a recording's report beside its other outputs: <c>report.pdf</c> and the FHIR R4 bundle
/// <c>report.fhir.json</c>, both from the model built from the analysis result summary.json comes from.
/// </summary>
public static class ReportOutputs
{
    public const string PdfName = "report.pdf";
    public const string FhirName = "report.fhir.json";

    /// <summary>Writes both files into <paramref name="folder"/>; <paramref name="input"/> is the one summarised (a pseudonym's when de-identified).</summary>
    public static void Write(OutputFolder folder, RecordingInput input, RecordingAnalysis a, ReportOptions options)
    {
        if (!options.Enabled)
        {
            return;
        }

        var id = a.Info.Identification;
        ReportPatient patient;
        if (options.Privacy is { } privacy)
        {
            // The input's name is already its pseudonym (Pseudonyms.Apply); the mapping goes to the key file only.
            patient = new ReportPatient { Pseudonym = input.Name, Sex = id.Sex };
            privacy.Remember(input.Name, id);
        }
        else
        {
            patient = new ReportPatient { Name = id.PatientName, Id = id.PatientId, BirthDate = id.BirthDate, Sex = id.Sex };
        }

        var model = ReportModelMapper.Build(a, input.Name, patient);
        using (var strips = OpenStrips(input.Path, a))
        {
            PdfReport.Write(folder.File(PdfName), model, options.Template, strips);
        }

        FhirBundleBuilder.Write(folder.File(FhirName), model, DateTimeOffset.Now);
    }

    /// <summary>The strip source over the analysed leads, or null when the beats came without a signal.</summary>
    public static RecordingStripSource? OpenStrips(string path, RecordingAnalysis a)
    {
        if (!a.Info.HasSignal || a.LeadLabels.Count == 0)
        {
            return null;
        }

        var reader = RecordingOpener.Open(path);
        try
        {
            var channels = EcgChannelSelector.Select(reader.Info);
            return new RecordingStripSource(reader, channels.Indices, channels.ReferenceRateHz, a.LeadLabels, a.Beats);
        }
        catch
        {
            reader.Dispose();
            throw;
        }
    }
}
