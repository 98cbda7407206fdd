using System.Buffers.Binary;
using System.Runtime.InteropServices;
using LongRecord.Formats.IO;

namespace LongRecord.Formats.Ishne;

/// <summary>
/// Reads an ISHNE Holter output file, version 1.0 (Badilini F., Ann Noninvasive Electrocardiol 1998;3(3):263–266).
/// Samples are returned in millivolts; the reserved value −32 768 (lead fault) reads as NaN. Memory is one fixed buffer.
/// </summary>
public sealed class IshneReader : RecordingReader
{
    // 128 KiB: large enough that a positioned read costs little per sample, small enough to stay in L2.
    private const int BufferBytes = 128 * 1024;

    private readonly ReadOnlyRecordingFile _file;
    private readonly byte[] _buffer = new byte[BufferBytes];
    private readonly float[] _millivoltsPerUnit;
    private readonly int _leadCount;
    private readonly int _framesPerBuffer;
    private float[] _scaleScratch = [];

    private IshneReader(ReadOnlyRecordingFile file, IshneHeader header)
    {
        _file = file;
        Header = header;
        _leadCount = header.Leads.Count;
        _framesPerBuffer = BufferBytes / (_leadCount * sizeof(short));
        _millivoltsPerUnit = new float[_leadCount];
        for (var k = 0; k < _leadCount; k++)
        {
            _millivoltsPerUnit[k] = (float)(header.Leads[k].ResolutionNv * 1e-6);
        }

        Info = IshneInfo.Describe(file.Path, header);
    }

    public override RecordingInfo Info { get; }

    /// <summary>The header fields as stored, including those <see cref="RecordingInfo"/> has no place for (lead quality, race, pacemaker).</summary>
    public IshneHeader Header { get; }

    /// <summary>Opens <paramref name="path"/> read-only and validates its header and checksum.</summary>
    /// <exception cref="RecordingFormatException">The file is missing, is not ISHNE 1.0, or its header is inconsistent.</exception>
    public static IshneReader Open(string path)
    {
        var file = ReadOnlyRecordingFile.Open(path);
        try
        {
            return new IshneReader(file, IshneHeaderParser.Read(file));
        }
        catch
        {
            file.Dispose();
            throw;
        }
    }

    /// <summary>True when <paramref name="head"/> (the first bytes of a file) starts with the magic number <c>ISHNE1.0</c>.</summary>
    public static bool Sniff(ReadOnlySpan<byte> head) => head.StartsWith(IshneLayout.Magic);

    protected override void ReadCore(int channel, long start, Span<float> destination)
    {
        var done = 0;
        while (done < destination.Length)
        {
            var frames = Math.Min(_framesPerBuffer, destination.Length - done);
            var samples = Fetch(start + done, frames);
            IshneSampleDecoder.DecodeLead(samples, _leadCount, channel, _millivoltsPerUnit[channel], destination.Slice(done, frames));
            done += frames;
        }
    }

    protected override void ReadCore(ReadOnlySpan<int> channels, long start, int count, Span<float> destination)
    {
        if (channels.Length == 1)
        {
            ReadCore(channels[0], start, destination[..count]);
            return;
        }

        if (_scaleScratch.Length < channels.Length)
        {
            _scaleScratch = new float[channels.Length];
        }

        var scales = _scaleScratch.AsSpan(0, channels.Length);
        for (var k = 0; k < channels.Length; k++)
        {
            scales[k] = _millivoltsPerUnit[channels[k]];
        }

        var done = 0;
        while (done < count)
        {
            var frames = Math.Min(_framesPerBuffer, count - done);
            var samples = Fetch(start + done, frames);
            IshneSampleDecoder.DecodeLeads(samples, _leadCount, frames, channels, scales, destination[done..], count);
            done += frames;
        }
    }

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            _file.Dispose();
        }
    }

    // Reads whole frames [firstFrame, firstFrame + frames) into the buffer and returns them as host-order shorts.
    private ReadOnlySpan<short> Fetch(long firstFrame, int frames)
    {
        var frameBytes = _leadCount * sizeof(short);
        var bytes = _buffer.AsSpan(0, frames * frameBytes);
        _file.ReadExactly(Header.EcgOffset + firstFrame * frameBytes, bytes, "the ECG block");
        var samples = MemoryMarshal.Cast<byte, short>(bytes);
        if (!BitConverter.IsLittleEndian)
        {
            BinaryPrimitives.ReverseEndianness(samples, MemoryMarshal.Cast<byte, short>(bytes));
        }

        return samples;
    }
}
