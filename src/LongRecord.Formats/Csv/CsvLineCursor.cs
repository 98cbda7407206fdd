using System.Diagnostics.CodeAnalysis;
using LongRecord.Formats.IO;

namespace LongRecord.Formats.Csv;

/// <summary>
/// Forward reader of text lines over positioned reads of a file, one fixed buffer. A line is returned without its
/// LF or CR LF terminator and stays valid until the next call.
/// </summary>
internal sealed class CsvLineCursor
{
    /// <summary>Longest line accepted; a twelve-lead row is about 200 bytes.</summary>
    public const int MaxLineBytes = 64 * 1024;

    private readonly ReadOnlyRecordingFile _file;
    private readonly byte[] _buffer = new byte[2 * MaxLineBytes];
    private long _bufferOffset;
    private int _position;
    private int _length;
    private bool _atEnd;

    public CsvLineCursor(ReadOnlyRecordingFile file) => _file = file;

    /// <summary>1-based number of the line last returned.</summary>
    public long LineNumber { get; private set; }

    /// <summary>Byte offset of the line last returned.</summary>
    public long LineOffset { get; private set; }

    /// <summary>Byte offset just past the line last returned (and its terminator).</summary>
    public long NextOffset => _bufferOffset + _position;

    /// <summary>Continues at <paramref name="offset"/>, which must start a line, numbering the next line <paramref name="nextLineNumber"/>.</summary>
    public void Seek(long offset, long nextLineNumber)
    {
        if (offset >= _bufferOffset && offset <= _bufferOffset + _length)
        {
            _position = (int)(offset - _bufferOffset);
        }
        else
        {
            _bufferOffset = offset;
            _position = 0;
            _length = 0;
            _atEnd = false;
        }

        LineNumber = nextLineNumber - 1;
    }

    public bool TryReadLine(out ReadOnlySpan<byte> line)
    {
        while (true)
        {
            var rest = _buffer.AsSpan(_position, _length - _position);
            var newline = rest.IndexOf((byte)'\n');
            if (newline >= 0 || (_atEnd && rest.Length > 0))
            {
                var end = newline >= 0 ? newline : rest.Length;
                if (end > MaxLineBytes)
                {
                    TooLong();
                }

                line = rest[..end];
                if (line.Length > 0 && line[^1] == (byte)'\r')
                {
                    line = line[..^1];
                }

                LineOffset = _bufferOffset + _position;
                LineNumber++;
                _position += newline >= 0 ? newline + 1 : rest.Length;
                return true;
            }

            if (_atEnd)
            {
                line = default;
                return false;
            }

            if (rest.Length > MaxLineBytes)
            {
                TooLong();
            }

            Refill();
        }
    }

    [DoesNotReturn]
    private void TooLong() =>
        RecordingFormatException.Throw(_file.Path, FormattableString.Invariant($"line {LineNumber + 1} is longer than {MaxLineBytes} bytes"), _bufferOffset + _position);

    private void Refill()
    {
        var keep = _length - _position;
        _buffer.AsSpan(_position, keep).CopyTo(_buffer);
        _bufferOffset += _position;
        _position = 0;
        var got = _file.ReadAtMost(_bufferOffset + keep, _buffer.AsSpan(keep));
        _length = keep + got;
        _atEnd = got == 0;
    }
}
