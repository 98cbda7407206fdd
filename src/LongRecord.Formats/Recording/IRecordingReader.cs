namespace LongRecord.Formats;

/// <summary>
/// A recording opened for block reads. Memory held by a reader does not depend on recording length.
/// Sample positions are 0-based on each channel's own rate, on the elapsed-time axis: a sample in an
/// EDF+D gap reads as NaN. Values are physical, in millivolts for voltage channels.
/// Not thread-safe: open one reader per thread.
/// </summary>
public interface IRecordingReader : IDisposable
{
    RecordingInfo Info { get; }

    /// <summary>
    /// Fills <paramref name="destination"/> with samples <paramref name="start"/> … start + length − 1 of
    /// <paramref name="channel"/>. Throws <see cref="ArgumentOutOfRangeException"/> for a range outside the channel and
    /// <see cref="RecordingFormatException"/> when the file cannot deliver them.
    /// </summary>
    void Read(int channel, long start, Span<float> destination);

    /// <summary>
    /// Reads <paramref name="count"/> samples from each of <paramref name="channels"/> (which must share one rate) into
    /// <paramref name="destination"/>, laid out channel after channel: channel k's samples are at k × count.
    /// Formats that interleave channels decode each byte once here.
    /// </summary>
    void Read(ReadOnlySpan<int> channels, long start, int count, Span<float> destination);
}
