namespace LongRecord.Formats.Ishne;

/// <summary>
/// CRC-CCITT of the ISHNE header (Badilini 1998, Appendix B): polynomial x¹⁶ + x¹² + x⁵ + 1 (0x1021), preset 0xFFFF,
/// most significant bit first, no final XOR. This is the catalogued CRC-16/CCITT-FALSE (check value 0x29B1).
/// </summary>
internal static class IshneCrc
{
    public const ushort Preset = 0xFFFF;
    private const ushort Polynomial = 0x1021;

    private static readonly ushort[] s_table = BuildTable();

    public static ushort Compute(ReadOnlySpan<byte> data) => Update(Preset, data);

    public static ushort Update(ushort crc, ReadOnlySpan<byte> data)
    {
        var table = s_table;
        foreach (var b in data)
        {
            crc = (ushort)((crc << 8) ^ table[(crc >> 8) ^ b]);
        }

        return crc;
    }

    private static ushort[] BuildTable()
    {
        var table = new ushort[256];
        for (var i = 0; i < 256; i++)
        {
            var r = (ushort)(i << 8);
            for (var bit = 0; bit < 8; bit++)
            {
                r = (r & 0x8000) != 0 ? (ushort)((r << 1) ^ Polynomial) : (ushort)(r << 1);
            }

            table[i] = r;
        }

        return table;
    }
}
