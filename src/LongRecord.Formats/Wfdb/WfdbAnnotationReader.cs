using System.Text;
using LongRecord.Formats.IO;

namespace LongRecord.Formats.Wfdb;

/// <summary>
/// Reads WFDB annotation files in MIT format (WFDB Applications Guide, annotation(5)): 16-bit little-endian words of a
/// 6-bit code and a 10-bit field; SKIP (59) adds a 32-bit interval written high word first; NUM (60) and CHN (62) set
/// the number and channel of the annotation before them and of those after; SUB (61) sets the subtype of the
/// annotation before it only; AUX (63) gives its text (length, then bytes, padded to even). Code 0 with field 0 ends
/// the file; bytes after it are ignored. A file cut short anywhere else is an error naming the byte.
/// </summary>
public static class WfdbAnnotationReader
{
    /// <summary>Reads every annotation of the file.</summary>
    /// <exception cref="RecordingFormatException">The file is missing or ends before its end-of-file marker.</exception>
    public static IReadOnlyList<WfdbAnnotation> Read(string path)
    {
        var list = new List<WfdbAnnotation>();
        foreach (var a in Enumerate(path))
        {
            list.Add(a);
        }

        return list;
    }

    /// <summary>Streams the annotations of the file in blocks; memory does not depend on the file's length.</summary>
    public static IEnumerable<WfdbAnnotation> Enumerate(string path)
    {
        using var file = ReadOnlyRecordingFile.Open(path);
        var cursor = new Cursor(file);
        var parser = new Parser(path, cursor);
        while (parser.Next(out var annotation))
        {
            yield return annotation;
        }
    }

    private sealed class Parser(string path, Cursor cursor)
    {
        private long _time;
        private byte _number;
        private byte _channel;
        private bool _pending;
        private WfdbAnnotation _current;
        private bool _ended;

        public bool Next(out WfdbAnnotation annotation)
        {
            annotation = default;
            while (!_ended)
            {
                var offset = cursor.Position;
                if (!cursor.TryWord(out var word))
                {
                    Fail(cursor.Length % 2 == 1 && cursor.Position == cursor.Length - 1
                        ? "file ends inside an annotation word (odd number of bytes)"
                        : "file ends without the end-of-file marker (code 0, time 0)", cursor.Position);
                }

                var code = word >> 10;
                var field = word & 0x3FF;
                if (code == 0 && field == 0)
                {
                    _ended = true;
                    return Flush(out annotation);
                }

                switch (code)
                {
                    case WfdbMitWords.Skip:
                        // The SKIP belongs to the next annotation, so the one before it is complete.
                        var ready = Flush(out annotation);
                        var low = 0;
                        if (!cursor.TryWord(out var high) || !cursor.TryWord(out low))
                        {
                            Fail("file ends inside the 4-byte interval of a SKIP word", offset + 2);
                        }

                        _time += (int)(((uint)high << 16) | (uint)low);
                        if (ready)
                        {
                            return true;
                        }

                        break;
                    case WfdbMitWords.Num:
                        _number = (byte)field;
                        _current = _current with { Number = _number };
                        break;
                    case WfdbMitWords.Chn:
                        _channel = (byte)field;
                        _current = _current with { Channel = _channel };
                        break;
                    case WfdbMitWords.Sub:
                        RequirePending("SUB", offset);
                        _current = _current with { Subtype = (sbyte)(byte)field };
                        break;
                    case WfdbMitWords.Aux:
                        RequirePending("AUX", offset);
                        _current = _current with { Aux = cursor.ReadText(field, path) };
                        break;
                    default:
                        var complete = Flush(out annotation);
                        _time += field;
                        _current = new WfdbAnnotation(_time, (WfdbAnnotationCode)code, 0, _channel, _number);
                        _pending = true;
                        if (complete)
                        {
                            return true;
                        }

                        break;
                }
            }

            return false;
        }

        private bool Flush(out WfdbAnnotation annotation)
        {
            annotation = _current;
            var had = _pending;
            _pending = false;
            return had;
        }

        private void RequirePending(string word, long offset)
        {
            if (!_pending)
            {
                Fail($"{word} word with no annotation before it", offset);
            }
        }

        [System.Diagnostics.CodeAnalysis.DoesNotReturn]
        private void Fail(string problem, long offset) => RecordingFormatException.Throw(path, problem, offset);
    }

    /// <summary>Reads 16-bit words and byte runs through a 64 KiB buffer of positioned reads.</summary>
    private sealed class Cursor(ReadOnlyRecordingFile file)
    {
        private readonly byte[] _buffer = new byte[1 << 16];
        private long _bufferStart;
        private int _bufferLength;

        public long Position { get; private set; }

        public long Length => file.Length;

        public bool TryWord(out int word)
        {
            word = 0;
            if (!Ensure(2))
            {
                return false;
            }

            var i = (int)(Position - _bufferStart);
            word = _buffer[i] | (_buffer[i + 1] << 8);
            Position += 2;
            return true;
        }

        public string ReadText(int length, string path)
        {
            var padded = length + (length & 1);
            if (!Ensure(padded))
            {
                RecordingFormatException.Throw(path, $"file ends inside the {length}-byte text of an AUX word (padded to {padded})", Position);
            }

            var bytes = _buffer.AsSpan((int)(Position - _bufferStart), length);
            var nul = bytes.IndexOf((byte)0);
            Position += padded;
            return Encoding.Latin1.GetString(nul < 0 ? bytes : bytes[..nul]);
        }

        private bool Ensure(int count)
        {
            if (Position + count <= _bufferStart + _bufferLength)
            {
                return true;
            }

            _bufferStart = Position;
            _bufferLength = file.ReadAtMost(Position, _buffer);
            return count <= _bufferLength;
        }
    }
}
