namespace LongRecord.Formats;

/// <summary>Shared argument checks and the channel-by-channel fallback of the multi-channel read.</summary>
public abstract class RecordingReader : IRecordingReader
{
    public abstract RecordingInfo Info { get; }

    public void Read(int channel, long start, Span<float> destination)
    {
        CheckRange(channel, start, destination.Length);
        ReadCore(channel, start, destination);
    }

    public void Read(ReadOnlySpan<int> channels, long start, int count, Span<float> destination)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        if (destination.Length < (long)channels.Length * count)
        {
            throw new ArgumentException("destination is shorter than channels × count", nameof(destination));
        }

        double rate = double.NaN;
        foreach (var c in channels)
        {
            CheckRange(c, start, count);
            var r = Info.Channels[c].SamplingRateHz;
            if (!double.IsNaN(rate) && r != rate)
            {
                throw new ArgumentException("channels of one multi-channel read must share a sampling rate", nameof(channels));
            }

            rate = r;
        }

        ReadCore(channels, start, count, destination);
    }

    /// <summary>Reads one channel; the range is already checked.</summary>
    protected abstract void ReadCore(int channel, long start, Span<float> destination);

    /// <summary>Reads several channels of one rate; the range is already checked. Override where decoding once pays.</summary>
    protected virtual void ReadCore(ReadOnlySpan<int> channels, long start, int count, Span<float> destination)
    {
        for (var k = 0; k < channels.Length; k++)
        {
            ReadCore(channels[k], start, destination.Slice(k * count, count));
        }
    }

    public void Dispose()
    {
        Dispose(true);
        GC.SuppressFinalize(this);
    }

    protected virtual void Dispose(bool disposing)
    {
    }

    private void CheckRange(int channel, long start, int length)
    {
        if (!Info.HasSignal)
        {
            RecordingFormatException.Throw(Info.FilePath, $"cannot read samples: {Info.NoSignalReason ?? "the recording holds no signal"}");
        }

        if ((uint)channel >= (uint)Info.Channels.Count)
        {
            throw new ArgumentOutOfRangeException(nameof(channel), channel, $"the recording has {Info.Channels.Count} channels");
        }

        var n = Info.Channels[channel].SampleCount;
        if (start < 0 || length < 0 || start + length > n)
        {
            throw new ArgumentOutOfRangeException(nameof(start), start, $"range [{start}, {start + length}) is outside the channel's {n} samples");
        }
    }
}
