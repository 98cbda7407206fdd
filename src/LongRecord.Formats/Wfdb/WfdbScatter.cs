namespace LongRecord.Formats.Wfdb;

/// <summary>Where one channel's samples sit in its signal file's frames, and how they become physical values.</summary>
/// <param name="Group">Index of the signal file.</param>
/// <param name="Slot">Position of the channel's first sample in the frame.</param>
/// <param name="SamplesPerFrame">The channel's samples in each frame.</param>
/// <param name="Baseline">Digital value of physical zero.</param>
/// <param name="Scale">Output units per digital unit (millivolts per unit ÷ gain for voltages).</param>
/// <param name="HasInvalid">True when the format has an invalid-sample value.</param>
/// <param name="Invalid">The stored value that reads as NaN.</param>
internal readonly record struct WfdbChannelMap(int Group, int Slot, int SamplesPerFrame, double Baseline, double Scale, bool HasInvalid, int Invalid);

/// <summary>Picks one channel's samples out of decoded frames and converts them to physical values.</summary>
internal static class WfdbScatter
{
    /// <summary>
    /// Writes <paramref name="output"/>.Length samples of the channel, beginning with its sample
    /// <paramref name="first"/> counted from the first frame of <paramref name="stream"/>.
    /// </summary>
    public static void Convert(ReadOnlySpan<int> stream, int frameSize, in WfdbChannelMap map, int first, Span<float> output)
    {
        var baseline = map.Baseline;
        var scale = map.Scale;
        if (map.SamplesPerFrame == 1)
        {
            var p = first * frameSize + map.Slot;

            // One range check up front; the loops below then stay inside the decoded frames.
            if (output.IsEmpty || p + (output.Length - 1) * frameSize >= stream.Length)
            {
                ArgumentOutOfRangeException.ThrowIfNotEqual(output.Length, 0, nameof(output));
                return;
            }

            if (map.HasInvalid)
            {
                var invalid = map.Invalid;
                for (var i = 0; i < output.Length; i++, p += frameSize)
                {
                    var v = stream[p];
                    output[i] = v == invalid ? float.NaN : (float)((v - baseline) * scale);
                }
            }
            else
            {
                for (var i = 0; i < output.Length; i++, p += frameSize)
                {
                    output[i] = (float)((stream[p] - baseline) * scale);
                }
            }

            return;
        }

        var spf = map.SamplesPerFrame;
        for (var i = 0; i < output.Length; i++)
        {
            var j = first + i;
            var v = stream[(j / spf) * frameSize + map.Slot + j % spf];
            output[i] = map.HasInvalid && v == map.Invalid ? float.NaN : (float)((v - baseline) * scale);
        }
    }
}
