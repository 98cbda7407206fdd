using System.Buffers.Binary;
using System.Text;

namespace LongRecord.Formats.Tests.Ishne;

/// <summary>
/// Assembles ISHNE 1.0 files byte by byte from the layout of Badilini 1998, Table 3, without the library's writer or
/// checksum code, so reader tests do not check the library against itself.
/// </summary>
internal sealed class IshneFileBuilder
{
    public short[] LeadCodes { get; set; } = [6, 15];

    public short[] Resolutions { get; set; } = [2500, 5000];

    public short[] Qualities { get; set; } = [1, 2];

    public short SamplingRateHz { get; set; } = 200;

    /// <summary>Interleaved samples; length must be a multiple of the lead count.</summary>
    public short[] Samples { get; set; } = [400, -200, 0, 32767, short.MinValue, -32767, 1, -1];

    public string FirstName { get; set; } = "Ilse";

    public string LastName { get; set; } = "Varenholt";

    public string SubjectId { get; set; } = "NW-0417";

    public short Sex { get; set; } = 2;

    public short[] BirthDate { get; set; } = [23, 7, 1961];

    public short[] RecordingDate { get; set; } = [4, 3, 2026];

    public short[] FileDate { get; set; } = [5, 3, 2026];

    public short[] StartTime { get; set; } = [8, 15, 0];

    public string Recorder { get; set; } = "digital";

    public string Proprietary { get; set; } = "Brackenfield Cardiology Clinic";

    public string Copyright { get; set; } = "demo data";

    public string VariableText { get; set; } = "diary: walk 09:10\nslept 23:00";

    public bool ChecksumBigEndian { get; set; }

    public int EcgOffset => 522 + Encoding.ASCII.GetByteCount(VariableText);

    public byte[] Build()
    {
        var text = Encoding.ASCII.GetBytes(VariableText);
        var bytes = new byte[522 + text.Length + Samples.Length * 2];
        var b = bytes.AsSpan();
        Encoding.ASCII.GetBytes("ISHNE1.0").CopyTo(b);
        BinaryPrimitives.WriteInt32LittleEndian(b[10..], text.Length);
        BinaryPrimitives.WriteInt32LittleEndian(b[14..], Samples.Length / LeadCodes.Length);
        BinaryPrimitives.WriteInt32LittleEndian(b[18..], 522);
        BinaryPrimitives.WriteInt32LittleEndian(b[22..], 522 + text.Length);
        BinaryPrimitives.WriteInt16LittleEndian(b[26..], 1);
        Encoding.ASCII.GetBytes(FirstName).CopyTo(b[28..]);
        Encoding.ASCII.GetBytes(LastName).CopyTo(b[68..]);
        Encoding.ASCII.GetBytes(SubjectId).CopyTo(b[108..]);
        BinaryPrimitives.WriteInt16LittleEndian(b[128..], Sex);
        Shorts(b, 132, BirthDate);
        Shorts(b, 138, RecordingDate);
        Shorts(b, 144, FileDate);
        Shorts(b, 150, StartTime);
        BinaryPrimitives.WriteInt16LittleEndian(b[156..], (short)LeadCodes.Length);
        for (var k = 0; k < 12; k++)
        {
            BinaryPrimitives.WriteInt16LittleEndian(b[(158 + 2 * k)..], k < LeadCodes.Length ? LeadCodes[k] : (short)-9);
            BinaryPrimitives.WriteInt16LittleEndian(b[(182 + 2 * k)..], k < Qualities.Length ? Qualities[k] : (short)-9);
            BinaryPrimitives.WriteInt16LittleEndian(b[(206 + 2 * k)..], k < Resolutions.Length ? Resolutions[k] : (short)-9);
        }

        BinaryPrimitives.WriteInt16LittleEndian(b[230..], 0);
        Encoding.ASCII.GetBytes(Recorder).CopyTo(b[232..]);
        BinaryPrimitives.WriteInt16LittleEndian(b[272..], SamplingRateHz);
        Encoding.ASCII.GetBytes(Proprietary).CopyTo(b[274..]);
        Encoding.ASCII.GetBytes(Copyright).CopyTo(b[354..]);
        text.CopyTo(b[522..]);
        for (var i = 0; i < Samples.Length; i++)
        {
            BinaryPrimitives.WriteInt16LittleEndian(b[(522 + text.Length + 2 * i)..], Samples[i]);
        }

        Seal(bytes, ChecksumBigEndian);
        return bytes;
    }

    /// <summary>Recomputes the checksum over bytes 10 … ECG offset − 1 (read from the bytes themselves) and stores it.</summary>
    public static void Seal(byte[] bytes, bool bigEndian)
    {
        var ecgOffset = BinaryPrimitives.ReadInt32LittleEndian(bytes.AsSpan(22));
        var crc = CrcCcitt(bytes.AsSpan(10, Math.Min(ecgOffset, bytes.Length) - 10));
        if (bigEndian)
        {
            BinaryPrimitives.WriteUInt16BigEndian(bytes.AsSpan(8), crc);
        }
        else
        {
            BinaryPrimitives.WriteUInt16LittleEndian(bytes.AsSpan(8), crc);
        }
    }

    /// <summary>
    /// CRC-CCITT bit by bit, straight from the definition in Appendix B: polynomial 0x1021, preset 0xFFFF, most
    /// significant bit first.
    /// </summary>
    public static ushort CrcCcitt(ReadOnlySpan<byte> data)
    {
        var crc = 0xFFFF;
        foreach (var value in data)
        {
            crc ^= value << 8;
            for (var bit = 0; bit < 8; bit++)
            {
                crc = (crc & 0x8000) != 0 ? ((crc << 1) ^ 0x1021) & 0xFFFF : (crc << 1) & 0xFFFF;
            }
        }

        return (ushort)crc;
    }

    private static void Shorts(Span<byte> b, int offset, short[] values)
    {
        for (var i = 0; i < values.Length; i++)
        {
            BinaryPrimitives.WriteInt16LittleEndian(b[(offset + 2 * i)..], values[i]);
        }
    }
}
