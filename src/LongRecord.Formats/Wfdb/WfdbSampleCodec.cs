using System.Buffers.Binary;

namespace LongRecord.Formats.Wfdb;

/// <summary>
/// Turns whole groups of signal-file bytes into the stored integer stream (WFDB Applications Guide, signal(5)).
/// One tight loop per format; format 8 yields the stored first differences, which the caller sums.
/// </summary>
internal static class WfdbSampleCodec
{
    /// <summary>
    /// Decodes <paramref name="source"/> (whole groups of <paramref name="format"/>) into <paramref name="destination"/>,
    /// which holds exactly groups × samples-per-group values.
    /// </summary>
    public static void Decode(WfdbFormat format, ReadOnlySpan<byte> source, Span<int> destination)
    {
        switch (format.Code)
        {
            case 8:
                for (var i = 0; i < destination.Length; i++)
                {
                    destination[i] = (sbyte)source[i];
                }

                break;
            case 80:
                for (var i = 0; i < destination.Length; i++)
                {
                    destination[i] = source[i] - 128;
                }

                break;
            case 16:
                Decode16(source, destination);
                break;
            case 61:
                for (var i = 0; i < destination.Length; i++)
                {
                    destination[i] = BinaryPrimitives.ReadInt16BigEndian(source.Slice(2 * i, 2));
                }

                break;
            case 160:
                for (var i = 0; i < destination.Length; i++)
                {
                    destination[i] = BinaryPrimitives.ReadUInt16LittleEndian(source.Slice(2 * i, 2)) - 32768;
                }

                break;
            case 24:
                for (var i = 0; i < destination.Length; i++)
                {
                    var b = source.Slice(3 * i, 3);
                    destination[i] = ((b[0] | (b[1] << 8) | (b[2] << 16)) << 8) >> 8;
                }

                break;
            case 32:
                for (var i = 0; i < destination.Length; i++)
                {
                    destination[i] = BinaryPrimitives.ReadInt32LittleEndian(source.Slice(4 * i, 4));
                }

                break;
            case 212:
                Decode212(source, destination);
                break;
            case 310:
                Decode310(source, destination);
                break;
            case 311:
                Decode311(source, destination);
                break;
            default:
                throw new ArgumentOutOfRangeException(nameof(format), format.Code, "format not decoded here");
        }
    }

    private static void Decode16(ReadOnlySpan<byte> source, Span<int> destination)
    {
        var words = System.Runtime.InteropServices.MemoryMarshal.Cast<byte, short>(source[..(2 * destination.Length)]);
        if (BitConverter.IsLittleEndian)
        {
            for (var i = 0; i < words.Length; i++)
            {
                destination[i] = words[i];
            }
        }
        else
        {
            for (var i = 0; i < words.Length; i++)
            {
                destination[i] = BinaryPrimitives.ReverseEndianness(words[i]);
            }
        }
    }

    // signal(5) format 212: bytes b0 b1 b2 hold two 12-bit samples: s0 = b0 | (low nibble of b1) << 8,
    // s1 = b2 | (high nibble of b1) << 4; both two's complement.
    private static void Decode212(ReadOnlySpan<byte> source, Span<int> destination)
    {
        var pairs = destination.Length / 2;
        source = source[..(3 * pairs)];
        destination = destination[..(2 * pairs)];
        for (int i = 0, j = 0; i + 2 < source.Length && j + 1 < destination.Length; i += 3, j += 2)
        {
            int b0 = source[i], b1 = source[i + 1], b2 = source[i + 2];
            destination[j] = ((b0 | (b1 << 8)) << 20) >> 20;
            destination[j + 1] = ((b2 | ((b1 & 0xF0) << 4)) << 20) >> 20;
        }
    }

    // signal(5) format 310: two little-endian 16-bit words w0, w1. s0 = bits 1–10 of w0, s1 = bits 1–10 of w1,
    // s2 = bits 11–15 of w0 (low five bits) and bits 11–15 of w1 (high five bits).
    private static void Decode310(ReadOnlySpan<byte> source, Span<int> destination)
    {
        var groups = destination.Length / 3;
        for (var g = 0; g < groups; g++)
        {
            int w0 = BinaryPrimitives.ReadUInt16LittleEndian(source.Slice(4 * g, 2));
            int w1 = BinaryPrimitives.ReadUInt16LittleEndian(source.Slice(4 * g + 2, 2));
            var d = destination.Slice(3 * g, 3);
            d[0] = (((w0 >> 1) & 0x3FF) << 22) >> 22;
            d[1] = (((w1 >> 1) & 0x3FF) << 22) >> 22;
            d[2] = ((((w0 >> 11) & 0x1F) | (((w1 >> 11) & 0x1F) << 5)) << 22) >> 22;
        }
    }

    // signal(5) format 311: one little-endian 32-bit word; s0 = bits 0–9, s1 = bits 10–19, s2 = bits 20–29.
    private static void Decode311(ReadOnlySpan<byte> source, Span<int> destination)
    {
        var groups = destination.Length / 3;
        for (var g = 0; g < groups; g++)
        {
            var w = BinaryPrimitives.ReadInt32LittleEndian(source.Slice(4 * g, 4));
            var d = destination.Slice(3 * g, 3);
            d[0] = (w << 22) >> 22;
            d[1] = (w << 12) >> 22;
            d[2] = (w << 2) >> 22;
        }
    }
}
