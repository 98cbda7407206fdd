using System.Buffers.Binary;
using System.Runtime.InteropServices;

namespace LongRecord.Formats.Ishne;

/// <summary>
/// Writes an ISHNE 1.0 Holter file as a stream of sample blocks. The file is built under a temporary name beside
/// <c>path</c> and renamed on <see cref="Complete"/>, which also writes the final sample count and the checksum;
/// disposing without completing removes the temporary file, so no partial output is ever left.
/// </summary>
public sealed class IshneWriter : IDisposable
{
    private const int FramesPerChunk = 8192;

    private readonly string _path;
    private readonly string _tempPath;
    private readonly byte[] _header;
    private readonly float[] _unitsPerMillivolt;
    private readonly short[] _chunk;
    private readonly int _leadCount;
    private FileStream? _stream;
    private long _samplesPerLead;
    private bool _completed;

    private IshneWriter(string path, byte[] header, IshneWriterOptions options)
    {
        _path = Path.GetFullPath(path);
        _header = header;
        _leadCount = options.Leads.Count;
        _unitsPerMillivolt = new float[_leadCount];
        for (var k = 0; k < _leadCount; k++)
        {
            _unitsPerMillivolt[k] = (float)(1e6 / options.Leads[k].ResolutionNv);
        }

        _chunk = new short[FramesPerChunk * _leadCount];
        _tempPath = Path.Combine(Path.GetDirectoryName(_path)!, $".{Path.GetFileName(_path)}.{Guid.NewGuid():N}.partial");
        _stream = new FileStream(_tempPath, FileMode.CreateNew, FileAccess.ReadWrite, FileShare.None, 1 << 16);
        _stream.Write(_header);
    }

    /// <summary>Samples per lead written so far.</summary>
    public long SamplesPerLead => _samplesPerLead;

    /// <summary>Starts a file that will appear at <paramref name="path"/> (replacing any file there) on <see cref="Complete"/>.</summary>
    public static IshneWriter Create(string path, IshneWriterOptions options)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        return new IshneWriter(path, IshneHeaderEncoder.Encode(options), options);
    }

    /// <summary>
    /// Appends <paramref name="count"/> samples per lead, given in millivolts and laid out lead after lead (lead k's samples at
    /// k × count), the layout of a multi-channel read. Values are rounded to the lead's resolution and clipped to ±32 767;
    /// NaN is written as the lead-fault value −32 768.
    /// </summary>
    public void Write(ReadOnlySpan<float> samplesMv, int count)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        if (samplesMv.Length < (long)count * _leadCount)
        {
            throw new ArgumentException("samples are shorter than leads × count", nameof(samplesMv));
        }

        for (var done = 0; done < count;)
        {
            var frames = Math.Min(FramesPerChunk, count - done);
            for (var k = 0; k < _leadCount; k++)
            {
                var source = samplesMv.Slice(k * count + done, frames);
                var scale = _unitsPerMillivolt[k];
                for (var f = 0; f < frames; f++)
                {
                    _chunk[f * _leadCount + k] = Quantise(source[f], scale);
                }
            }

            WriteDigital(_chunk.AsSpan(0, frames * _leadCount));
            done += frames;
        }
    }

    /// <summary>Appends digital samples as stored: interleaved frames (lead 1, lead 2, …, lead N, lead 1, …).</summary>
    public void WriteDigital(ReadOnlySpan<short> interleaved)
    {
        var stream = _stream ?? throw new ObjectDisposedException(nameof(IshneWriter));
        if (interleaved.Length % _leadCount != 0)
        {
            throw new ArgumentException($"length {interleaved.Length} is not a whole number of {_leadCount}-lead frames", nameof(interleaved));
        }

        var frames = interleaved.Length / _leadCount;
        if (_samplesPerLead + frames > int.MaxValue)
        {
            throw new InvalidOperationException("the header's samples-per-lead field holds at most 2 147 483 647 samples");
        }

        if (BitConverter.IsLittleEndian)
        {
            stream.Write(MemoryMarshal.AsBytes(interleaved));
        }
        else
        {
            Span<byte> two = stackalloc byte[2];
            foreach (var s in interleaved)
            {
                BinaryPrimitives.WriteInt16LittleEndian(two, s);
                stream.Write(two);
            }
        }

        _samplesPerLead += frames;
    }

    /// <summary>Writes the final header and moves the file to its name.</summary>
    public void Complete()
    {
        var stream = _stream ?? throw new ObjectDisposedException(nameof(IshneWriter));
        IshneHeaderEncoder.Seal(_header, (int)_samplesPerLead);
        stream.Position = 0;
        stream.Write(_header);
        stream.Flush(flushToDisk: true);
        stream.Dispose();
        _stream = null;
        File.Move(_tempPath, _path, overwrite: true);
        _completed = true;
    }

    public void Dispose()
    {
        if (_stream is not null)
        {
            _stream.Dispose();
            _stream = null;
        }

        if (!_completed)
        {
            File.Delete(_tempPath);
        }
    }

    private static short Quantise(float millivolts, float unitsPerMillivolt)
    {
        if (float.IsNaN(millivolts))
        {
            return IshneLayout.LeadFault;
        }

        var units = MathF.Round(millivolts * unitsPerMillivolt);
        return (short)Math.Clamp(units, -short.MaxValue, short.MaxValue);
    }
}
