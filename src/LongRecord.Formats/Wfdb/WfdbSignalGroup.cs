using LongRecord.Formats.IO;

namespace LongRecord.Formats.Wfdb;

/// <summary>
/// The signals that share one signal file (a header(5) "signal group"). Each frame holds, in signal order, that
/// signal's samples-per-frame values; the file is one stream of such frames after the byte offset. Decodes frame
/// ranges into a reused buffer, so memory does not depend on the recording's length.
/// </summary>
internal sealed class WfdbSignalGroup : IDisposable
{
    // Stream samples decoded per positioned read: 2 signals of format 212 give 196 KiB reads.
    private const int ChunkSamples = 1 << 17;

    private readonly ReadOnlyRecordingFile _file;
    private readonly long _byteOffset;
    private readonly int[] _slotSignal;
    private readonly int[] _initialValues;
    private byte[]? _bytes;
    private int[]? _samples;

    // Format 8 stores differences: the running value of each signal after frame _differenceFrame − 1.
    private long _differenceFrame;
    private int[]? _running;

    public WfdbSignalGroup(ReadOnlyRecordingFile file, WfdbFormat format, long byteOffset, IReadOnlyList<WfdbSignalSpec> signals, long frameCount)
    {
        _file = file;
        FileName = signals[0].FileName;
        Format = format;
        _byteOffset = byteOffset;
        FrameCount = frameCount;
        SlotOfSignal = new int[signals.Count];
        var slots = new List<int>();
        for (var s = 0; s < signals.Count; s++)
        {
            SlotOfSignal[s] = slots.Count;
            for (var k = 0; k < signals[s].SamplesPerFrame; k++)
            {
                slots.Add(s);
            }
        }

        _slotSignal = [.. slots];
        FrameSize = _slotSignal.Length;
        _initialValues = signals.Select(s => s.EffectiveInitialValue).ToArray();
        MaxFramesPerChunk = Math.Max(1, ChunkSamples / FrameSize);
    }

    public WfdbFormat Format { get; }

    /// <summary>The signal file name as the header writes it.</summary>
    public string FileName { get; }

    public long ByteOffset => _byteOffset;

    public long FileLength => _file.Length;

    /// <summary>Stream samples in one frame (sum of the group's samples per frame).</summary>
    public int FrameSize { get; }

    /// <summary>Position in the frame of each signal's first sample.</summary>
    public int[] SlotOfSignal { get; }

    public long FrameCount { get; }

    public int MaxFramesPerChunk { get; }

    /// <summary>Bytes the file needs (offset included) to hold <paramref name="frames"/> whole frames.</summary>
    public long RequiredLength(long frames) => _byteOffset + Format.MinimumBytes(frames * FrameSize);

    /// <summary>Whole frames the file holds after the byte offset.</summary>
    public static long FramesIn(long fileLength, long byteOffset, WfdbFormat format, int frameSize)
    {
        var bytes = Math.Max(0, fileLength - byteOffset);
        var groups = bytes / format.BytesPerGroup;
        var samples = groups * format.SamplesPerGroup;

        // A cut-short last group may still hold whole samples (format 212 with an odd count, for example).
        var rest = (int)(bytes % format.BytesPerGroup);
        for (var extra = format.SamplesPerGroup - 1; extra > 0; extra--)
        {
            if (format.MinimumBytes(samples + extra) - groups * format.BytesPerGroup <= rest)
            {
                samples += extra;
                break;
            }
        }

        return samples / frameSize;
    }

    /// <summary>
    /// Decodes frames <paramref name="firstFrame"/> … + <paramref name="frameCount"/> − 1 (at most
    /// <see cref="MaxFramesPerChunk"/>) and returns their stream samples, frame after frame. The span is valid until the
    /// next call.
    /// </summary>
    public ReadOnlySpan<int> DecodeFrames(long firstFrame, int frameCount)
    {
        if (Format.Code == 8)
        {
            return DecodeDifferences(firstFrame, frameCount);
        }

        return DecodeRaw(firstFrame, frameCount);
    }

    private Span<int> DecodeRaw(long firstFrame, int frameCount)
    {
        var g = Format.SamplesPerGroup;
        var b = Format.BytesPerGroup;
        var s0 = firstFrame * FrameSize;
        var s1 = s0 + (long)frameCount * FrameSize;
        var group0 = s0 / g;
        var group1 = (s1 + g - 1) / g;
        var groups = (int)(group1 - group0);

        _bytes ??= new byte[(MaxFramesPerChunk * FrameSize / g + 2) * b];
        _samples ??= new int[(MaxFramesPerChunk * FrameSize / g + 2) * g];
        var bytes = _bytes.AsSpan(0, groups * b);
        var start = _byteOffset + group0 * b;
        var got = _file.ReadAtMost(start, bytes);
        var needed = _byteOffset + Format.MinimumBytes(s1) - start;
        if (got < needed)
        {
            var frame = (group0 + got / b) * g / FrameSize;
            RecordingFormatException.Throw(_file.Path, $"file ends inside frame {frame} ({needed} bytes needed from byte {start}, {got} present)", start + got);
        }

        bytes[got..].Clear();
        var samples = _samples.AsSpan(0, groups * g);
        WfdbSampleCodec.Decode(Format, bytes, samples);
        return samples.Slice((int)(s0 - group0 * g), frameCount * FrameSize);
    }

    private ReadOnlySpan<int> DecodeDifferences(long firstFrame, int frameCount)
    {
        // Sample n = initial value + the first n + 1 stored differences of that signal (signal(5) format 8; the first
        // stored difference is 0 when the initial value is sample 0). Random access re-sums from the start; reading
        // forwards continues from the last position.
        if (_running is null || firstFrame < _differenceFrame)
        {
            _running = (int[])_initialValues.Clone();
            _differenceFrame = 0;
        }

        while (_differenceFrame < firstFrame)
        {
            var n = (int)Math.Min(MaxFramesPerChunk, firstFrame - _differenceFrame);
            Accumulate(DecodeRaw(_differenceFrame, n));
            _differenceFrame += n;
        }

        var span = DecodeRaw(firstFrame, frameCount);
        Accumulate(span);
        _differenceFrame = firstFrame + frameCount;
        return span;
    }

    private void Accumulate(Span<int> mutable)
    {
        var running = _running!;
        for (var i = 0; i < mutable.Length; i += FrameSize)
        {
            for (var k = 0; k < FrameSize; k++)
            {
                var s = _slotSignal[k];
                running[s] += mutable[i + k];
                mutable[i + k] = running[s];
            }
        }
    }

    public void Dispose() => _file.Dispose();
}
