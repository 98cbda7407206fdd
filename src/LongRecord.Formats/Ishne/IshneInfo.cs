namespace LongRecord.Formats.Ishne;

/// <summary>Maps a validated ISHNE header onto the format-neutral <see cref="RecordingInfo"/>.</summary>
internal static class IshneInfo
{
    public static RecordingInfo Describe(string path, IshneHeader header)
    {
        var labels = Labels(header.Leads);
        var channels = new ChannelInfo[header.Leads.Count];
        for (var k = 0; k < channels.Length; k++)
        {
            channels[k] = new ChannelInfo
            {
                Label = labels[k],
                PhysicalUnit = "mV",
                SamplingRateHz = header.SamplingRateHz,
                SampleCount = header.SamplesPerLead,

                // Physical value = sample × resolution (nV), so one millivolt is 10⁶ / resolution digital units.
                Gain = 1e6 / header.Leads[k].ResolutionNv,
                Baseline = 0,

                // −32 768 is reserved for lead fault, so the recorder's range ends one step short of it.
                DigitalMin = IshneLayout.LeadFault + 1,
                DigitalMax = short.MaxValue,
            };
        }

        return new RecordingInfo
        {
            FilePath = path,
            Format = RecordingFormat.Ishne,
            FormatDetail = "ISHNE 1.0",
            Channels = channels,
            StartDate = header.RecordingDate,
            StartTime = header.StartTime,
            DurationS = header.SamplesPerLead / (double)header.SamplingRateHz,
            Identification = Identify(header),
            Comments = Lines(header.VariableBlockText),
        };
    }

    /// <summary>
    /// Table 1 labels; codes outside the table (and code 0, "unknown") become "lead k" with k the 1-based storage position.
    /// A label used by several leads (three "generic bipolar" leads is a common Holter set) gets its position appended.
    /// </summary>
    public static string[] Labels(IReadOnlyList<IshneLead> leads)
    {
        var labels = new string[leads.Count];
        for (var k = 0; k < labels.Length; k++)
        {
            labels[k] = IshneLead.LabelOf(leads[k].Code) ?? $"lead {k + 1}";
        }

        var result = new string[labels.Length];
        for (var k = 0; k < labels.Length; k++)
        {
            var shared = Array.FindAll(labels, l => l == labels[k]).Length > 1;
            result[k] = shared ? $"{labels[k]} (lead {k + 1})" : labels[k];
        }

        return result;
    }

    private static Identification Identify(IshneHeader header)
    {
        var name = Join(" ", header.FirstName, header.LastName);
        return new Identification
        {
            PatientField = Join(" ", name, header.SubjectId),
            RecordingField = Join("; ", header.RecorderType, header.Proprietary, header.Copyright),
            PatientName = name.Length > 0 ? name : null,
            PatientId = header.SubjectId.Length > 0 ? header.SubjectId : null,
            Sex = header.Sex switch
            {
                IshneSex.Male => "M",
                IshneSex.Female => "F",
                _ => null,
            },
            BirthDate = header.BirthDate?.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture),
        };
    }

    private static string Join(string separator, params string[] parts) =>
        string.Join(separator, Array.FindAll(parts, p => p.Length > 0));

    private static string[] Lines(string text) =>
        text.Split(['\r', '\n'], StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
}
