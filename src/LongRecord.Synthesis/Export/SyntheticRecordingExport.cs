using LongRecord.Formats.Edf;
using LongRecord.Formats.Wfdb;
using LongRecord.Synthesis.Truth;

namespace LongRecord.Synthesis.Export;

/// <summary>
/// Writes a synthetic recording the way a recorder's export would arrive: an EDF+ file (1-s data records, patient and
/// recording fields of the invented scenario, diary entries as EDF+ annotations), its truth as a WFDB annotation file beside it (<c>NAME.atr</c>, so any
/// WFDB viewer shows it), and the full truth as JSON (<c>NAME.truth.json</c>). Streams in one-record blocks; every file
/// is written under a temporary name and renamed when complete.
/// </summary>
public static class SyntheticRecordingExport
{
    /// <summary>Physical range of every lead, mV: wide enough for lead-off stretches at the ±5 mV rail.</summary>
    public const double PhysicalRangeMv = 10;

    public static SyntheticExportPaths Write(SyntheticRecording recording, string edfPath, CancellationToken cancellation = default)
    {
        var rate = recording.SamplingRateHz;
        if (rate != Math.Round(rate))
        {
            throw new ArgumentException($"EDF+ export needs a whole number of samples per second (rate {rate} Hz)", nameof(recording));
        }

        var paths = SyntheticExportPaths.For(edfPath);
        var dir = Path.GetDirectoryName(Path.GetFullPath(edfPath));
        if (dir is not null)
        {
            Directory.CreateDirectory(dir);
        }

        WriteEdf(recording, paths.Edf, (int)rate, cancellation);
        WfdbAnnotationWriter.Write(paths.Annotations, ToWfdb(recording.Truth.Annotations()));
        TruthDocument.From(recording).Save(paths.Truth);
        return paths;
    }

    private static void WriteEdf(SyntheticRecording recording, string path, int samplesPerRecord, CancellationToken cancellation)
    {
        var id = recording.Identification;
        var patient = recording.Scenario.Patient;
        var channels = recording.Leads.Select(label => new EdfWriterChannel
        {
            Label = label,
            Transducer = "synthetic ECG",
            PhysicalUnit = "mV",
            PhysicalMin = -PhysicalRangeMv,
            PhysicalMax = PhysicalRangeMv,
            SamplesPerRecord = samplesPerRecord,
        }).ToArray();
        var options = new EdfWriterOptions
        {
            Channels = channels,
            Start = recording.StartDateTime,
            PatientCode = patient.Id,
            PatientSex = patient.Sex is "F" or "M" ? patient.Sex : null,
            PatientBirthDate = patient.BirthDate,
            PatientName = patient.Name,
            AdminCode = recording.Scenario.Recording.Id,
            Technician = recording.Scenario.Recording.Technician,
            Equipment = recording.Scenario.Recording.Device,
        };
        using var writer = new EdfWriter(path, options);
        foreach (var e in recording.Diary)
        {
            writer.AddAnnotation(e.AtS, null, e.Text);
        }

        var leads = recording.Leads.Count;
        var block = new float[leads * samplesPerRecord];
        for (long start = 0; start < recording.SampleCount; start += samplesPerRecord)
        {
            cancellation.ThrowIfCancellationRequested();
            var count = (int)Math.Min(samplesPerRecord, recording.SampleCount - start);
            recording.Render(start, count, block.AsSpan(0, leads * count));
            writer.WriteSamples(block.AsSpan(0, leads * count), count);
        }

        writer.Complete();
    }

    /// <summary>Maps the neutral truth list onto MIT-format annotations (mnemonics as the WFDB code table names them).</summary>
    public static IEnumerable<WfdbAnnotation> ToWfdb(IEnumerable<TruthAnnotation> truth)
    {
        foreach (var a in truth)
        {
            var code = WfdbAnnotationCodes.FromMnemonic(a.Code)
                ?? throw new InvalidOperationException($"truth annotation code '{a.Code}' has no WFDB code");
            var sub = a.Code == "~" ? (sbyte)Math.Clamp(a.NoisyLeadMask, 0, 127) : (sbyte)0;
            yield return new WfdbAnnotation(a.Sample, code, sub, 0, 0, a.Aux);
        }
    }
}
