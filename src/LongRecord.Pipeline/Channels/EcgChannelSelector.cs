using System.Text.RegularExpressions;
using LongRecord.Formats;

namespace LongRecord.Pipeline.Channels;

/// <summary>
/// Chooses the ECG channels of a recording: voltage channels whose labels look like ECG leads (or, when no label says
/// so, every voltage channel that is not plainly something else), all at the rate of the first of them, <c>f_ref</c>.
/// Channels at other rates are left out (the README says so).
/// </summary>
public static partial class EcgChannelSelector
{
    /// <summary>At most this many leads go into the analysis (a 12-lead Holter is the largest we expect).</summary>
    public const int MaxLeads = 12;

    public static EcgChannels Select(RecordingInfo info)
    {
        var voltage = Enumerable.Range(0, info.Channels.Count).Where(i => info.Channels[i].IsVoltage && info.Channels[i].SamplingRateHz >= 50).ToList();
        var ecg = voltage.Where(i => EcgLike().IsMatch(info.Channels[i].Label)).ToList();
        if (ecg.Count == 0)
        {
            ecg = voltage.Where(i => !OtherSignal().IsMatch(info.Channels[i].Label)).ToList();
        }

        if (ecg.Count == 0)
        {
            var labels = string.Join(", ", info.Channels.Take(8).Select(c => $"'{c.Label}'"));
            throw new RecordingFormatException(info.FilePath,
                info.Channels.Count == 0 ? "no signal channels to analyse" : $"no ECG channel among its {info.Channels.Count} channels ({labels}{(info.Channels.Count > 8 ? ", …" : "")})");
        }

        var fRef = info.Channels[ecg[0]].SamplingRateHz;
        var chosen = ecg.Where(i => info.Channels[i].SamplingRateHz == fRef).Take(MaxLeads).ToArray();
        var skipped = ecg.Where(i => !chosen.Contains(i)).ToArray();
        return new EcgChannels(chosen, fRef, info.Channels[chosen[0]].SampleCount, skipped);
    }

    // ECG lead names as recorders write them: "ECG", "EKG", "MLII", "V1"…"V6", limb leads, "CM5", "lead 2", "ch1".
    [GeneratedRegex(@"^\s*(ecg|ekg|ml\s*i|m[lc]\d|v\s*[1-6]|(a\s*)?v[rlf]\b|i{1,3}\b|cm\d|cc\d|lead|chan|ch\s*\d|d[1-3]\b)|\b(ecg|ekg)\b", RegexOptions.IgnoreCase)]
    private static partial Regex EcgLike();

    // Labels that name something else: EEG, EOG, EMG, respiration, oximetry, markers.
    [GeneratedRegex(@"\b(eeg|eog|emg|resp|spo2|sao2|pleth|pulse|flow|thor|abdo|snore|temp|pos|accel|acc|status|marker|event|annotation)", RegexOptions.IgnoreCase)]
    private static partial Regex OtherSignal();
}

/// <summary>The channels the analysis uses, the reference rate and its sample count.</summary>
public sealed record EcgChannels(int[] Indices, double ReferenceRateHz, long SampleCount, int[] SkippedOtherRate);
