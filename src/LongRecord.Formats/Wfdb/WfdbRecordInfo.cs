namespace LongRecord.Formats.Wfdb;

/// <summary>Builds the format-neutral <see cref="RecordingInfo"/> of a WFDB record from its header.</summary>
internal static class WfdbRecordInfo
{
    public static RecordingInfo Build(WfdbHeader header, WfdbFormat[] formats, long frames, string? noSignalReason)
    {
        var channels = new List<ChannelInfo>(header.SignalCount);
        for (var i = 0; i < header.SignalCount; i++)
        {
            var s = header.Signals[i];
            var bits = s.AdcResolution > 0 ? s.AdcResolution : formats[i].DefaultResolutionBits;
            var half = 1L << Math.Clamp(bits - 1, 0, 31);
            channels.Add(new ChannelInfo
            {
                // header(5): a missing description reads as "record xxx, signal n".
                Label = s.Description ?? $"record {header.RecordName}, signal {i}",
                PhysicalUnit = s.Units ?? "",
                SamplingRateHz = header.SamplingFrequencyHz * s.SamplesPerFrame,
                SampleCount = frames * s.SamplesPerFrame,
                Gain = s.EffectiveGain,
                Baseline = s.EffectiveBaseline,
                DigitalMin = (int)Math.Clamp(s.AdcZero - half, int.MinValue, int.MaxValue),
                DigitalMax = (int)Math.Clamp(s.AdcZero + half - 1, int.MinValue, int.MaxValue),
            });
        }

        var codes = header.Signals.Select(s => s.Format).Distinct().Order().ToArray();
        var detail = codes.Length switch
        {
            0 => "WFDB (no signals)",
            1 => $"WFDB (format {codes[0]})",
            _ => $"WFDB (formats {string.Join(", ", codes)})",
        };

        return new RecordingInfo
        {
            FilePath = header.FilePath,
            Format = RecordingFormat.Wfdb,
            FormatDetail = detail,
            Channels = channels,
            StartDate = header.BaseDate,
            StartTime = header.BaseTime,
            DurationS = frames / header.SamplingFrequencyHz,
            Identification = new Identification { PatientField = string.Join("; ", header.InfoStrings) },
            Comments = header.Comments,
            HasSignal = noSignalReason is null,
            NoSignalReason = noSignalReason,
        };
    }
}
