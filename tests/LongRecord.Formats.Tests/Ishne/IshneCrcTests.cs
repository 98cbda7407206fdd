using System.Text;
using LongRecord.Formats.Ishne;

namespace LongRecord.Formats.Tests.Ishne;

public class IshneCrcTests
{
    // CRC-16/CCITT-FALSE check value for the ASCII string "123456789" is 0x29B1 (the catalogue's standard check;
    // Badilini 1998 Appendix B defines the same CRC: polynomial 0x1021, preset 0xFFFF).
    [Fact]
    public void Crc_CcittFalseCheckValue_123456789_Is0x29B1()
    {
        Assert.Equal((ushort)0x29B1, IshneCrc.Compute(Encoding.ASCII.GetBytes("123456789")));
    }

    [Fact]
    public void TestSideBitwiseCrc_CcittFalseCheckValue_123456789_Is0x29B1()
    {
        Assert.Equal((ushort)0x29B1, IshneFileBuilder.CrcCcitt(Encoding.ASCII.GetBytes("123456789")));
    }

    // The empty message leaves the preset untouched: 0xFFFF (definition of a CRC with no final XOR).
    [Fact]
    public void Crc_EmptyInput_IsPreset()
    {
        Assert.Equal((ushort)0xFFFF, IshneCrc.Compute([]));
    }

    [Fact]
    public void Crc_IncrementalUpdate_EqualsOneShot()
    {
        var data = new byte[1000];
        new Random(7).NextBytes(data);
        var split = IshneCrc.Update(IshneCrc.Compute(data.AsSpan(0, 333)), data.AsSpan(333));
        Assert.Equal(IshneFileBuilder.CrcCcitt(data), split);
    }
}
