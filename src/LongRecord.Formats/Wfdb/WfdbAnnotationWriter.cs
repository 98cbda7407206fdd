using System.Buffers.Binary;
using System.Text;

namespace LongRecord.Formats.Wfdb;

/// <summary>
/// Writes WFDB annotation files in MIT format (annotation(5)). Each annotation is one word of code and time difference;
/// a difference above 1023 or below 0 goes into a SKIP word before it; SUB follows when the subtype is not 0, CHN and
/// NUM when channel or number differ from the previous annotation's (both start at 0), AUX when there is text. The
/// file ends with the end-of-file word. Output goes to a temporary file renamed over <c>path</c> when complete.
/// </summary>
public static class WfdbAnnotationWriter
{
    /// <summary>Longest AUX text, in bytes: the WFDB library keeps the length in one byte.</summary>
    public const int MaxAuxBytes = 255;

    private const int MaxFieldValue = 1023;

    /// <summary>Writes <paramref name="annotations"/> (in file order) to <paramref name="path"/>.</summary>
    /// <exception cref="ArgumentException">An annotation has code 0 or above <see cref="WfdbAnnotationCodes.MaxCode"/>,
    /// or AUX text that is too long, holds NUL or a character outside Latin-1.</exception>
    public static void Write(string path, IEnumerable<WfdbAnnotation> annotations)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        ArgumentNullException.ThrowIfNull(annotations);
        var full = Path.GetFullPath(path);
        var temp = Path.Combine(Path.GetDirectoryName(full) ?? ".", $".{Path.GetFileName(full)}.{Guid.NewGuid():N}.tmp");
        try
        {
            using (var stream = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None, 1 << 16))
            {
                WriteTo(stream, annotations);
            }

            File.Move(temp, full, overwrite: true);
        }
        catch
        {
            File.Delete(temp);
            throw;
        }
    }

    private static void WriteTo(Stream stream, IEnumerable<WfdbAnnotation> annotations)
    {
        var buffer = new byte[1 << 16];
        var used = 0;
        long previous = 0;
        byte number = 0;
        byte channel = 0;

        void Raw(uint value)
        {
            if (used + 2 > buffer.Length)
            {
                stream.Write(buffer, 0, used);
                used = 0;
            }

            BinaryPrimitives.WriteUInt16LittleEndian(buffer.AsSpan(used), (ushort)value);
            used += 2;
        }

        void Word(int code, int field) => Raw((uint)((code << 10) | field));

        foreach (var a in annotations)
        {
            var code = (int)a.Code;
            if (code is < 1 or > WfdbAnnotationCodes.MaxCode)
            {
                throw new ArgumentException($"annotation at sample {a.Sample}: code {code} cannot be written (1–{WfdbAnnotationCodes.MaxCode})", nameof(annotations));
            }

            var aux = a.Aux is null ? null : AuxBytes(a);
            var delta = a.Sample - previous;
            while (delta is < 0 or > MaxFieldValue)
            {
                var step = (int)Math.Clamp(delta, int.MinValue, int.MaxValue);

                // annotation(5): SKIP's own field is 0; the interval follows as a PDP-11 long (high word first).
                Word(WfdbMitWords.Skip, 0);
                Raw((uint)step >> 16);
                Raw((uint)step & 0xFFFF);
                delta -= step;
            }

            Word(code, (int)delta);
            if (a.Subtype != 0)
            {
                Word(WfdbMitWords.Sub, (byte)a.Subtype);
            }

            if (a.Channel != channel)
            {
                Word(WfdbMitWords.Chn, a.Channel);
                channel = a.Channel;
            }

            if (a.Number != number)
            {
                Word(WfdbMitWords.Num, a.Number);
                number = a.Number;
            }

            if (aux is not null)
            {
                Word(WfdbMitWords.Aux, aux.Length);
                var padded = aux.Length + (aux.Length & 1);
                if (used + padded > buffer.Length)
                {
                    stream.Write(buffer, 0, used);
                    used = 0;
                }

                aux.CopyTo(buffer.AsSpan(used));
                buffer.AsSpan(used + aux.Length, padded - aux.Length).Clear();
                used += padded;
            }

            previous = a.Sample;
        }

        Word(0, 0);
        stream.Write(buffer, 0, used);
    }

    private static byte[] AuxBytes(WfdbAnnotation a)
    {
        var text = a.Aux!;
        foreach (var c in text)
        {
            if (c == '\0' || c > '\u00FF')
            {
                throw new ArgumentException($"annotation at sample {a.Sample}: AUX text may hold only Latin-1 characters other than NUL", nameof(a));
            }
        }

        if (text.Length > MaxAuxBytes)
        {
            throw new ArgumentException($"annotation at sample {a.Sample}: AUX text is {text.Length} bytes, more than {MaxAuxBytes}", nameof(a));
        }

        return Encoding.Latin1.GetBytes(text);
    }
}
