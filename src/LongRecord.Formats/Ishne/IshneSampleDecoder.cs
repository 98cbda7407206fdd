namespace LongRecord.Formats.Ishne;

/// <summary>Turns interleaved 16-bit samples (already in host byte order) into millivolts.</summary>
internal static class IshneSampleDecoder
{
    /// <summary>Decodes lead <paramref name="lead"/> of every frame in <paramref name="frames"/>.</summary>
    public static void DecodeLead(ReadOnlySpan<short> frames, int leadCount, int lead, float millivoltsPerUnit, Span<float> destination)
    {
        var i = lead;
        for (var f = 0; f < destination.Length; f++)
        {
            destination[f] = Convert(frames[i], millivoltsPerUnit);
            i += leadCount;
        }
    }

    /// <summary>
    /// Decodes several leads frame by frame, so each frame is visited once. Lead k of frame f goes to
    /// <paramref name="destination"/>[k × <paramref name="stride"/> + f].
    /// </summary>
    public static void DecodeLeads(
        ReadOnlySpan<short> frames, int leadCount, int frameCount, ReadOnlySpan<int> leads, ReadOnlySpan<float> millivoltsPerUnit,
        Span<float> destination, int stride)
    {
        if (leads.Length == 2)
        {
            DecodeTwo(frames, leadCount, frameCount, leads[0], leads[1], millivoltsPerUnit[0], millivoltsPerUnit[1], destination, stride);
            return;
        }

        var start = 0;
        for (var f = 0; f < frameCount; f++)
        {
            for (var k = 0; k < leads.Length; k++)
            {
                destination[k * stride + f] = Convert(frames[start + leads[k]], millivoltsPerUnit[k]);
            }

            start += leadCount;
        }
    }

    // Two leads is the common Holter layout; unrolling it keeps both output streams in registers.
    private static void DecodeTwo(
        ReadOnlySpan<short> frames, int leadCount, int frameCount, int lead0, int lead1, float scale0, float scale1,
        Span<float> destination, int stride)
    {
        var first = destination.Slice(0, frameCount);
        var second = destination.Slice(stride, frameCount);
        var start = 0;
        for (var f = 0; f < first.Length; f++)
        {
            first[f] = Convert(frames[start + lead0], scale0);
            second[f] = Convert(frames[start + lead1], scale1);
            start += leadCount;
        }
    }

    private static float Convert(short sample, float millivoltsPerUnit) =>
        sample == IshneLayout.LeadFault ? float.NaN : sample * millivoltsPerUnit;
}
