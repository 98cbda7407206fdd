using System.Buffers.Binary;
using System.Text;
using LongRecord.Formats.Ishne;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Ishne;

/// <summary>
/// Reads a file written by <see cref="IshneWriter"/> with plain byte arithmetic at the offsets of Badilini 1998, Table 3
/// (as listed in shared/notes/ishne-layout.md), so the writer is checked against the standard, not against the reader.
/// </summary>
public class IshneWriterLayoutTests
{
    [Fact]
    public void Writer_PutsEveryFieldAtTable3Offset_AndChecksumMatchesAppendixB()
    {
        using var temp = new TempFolder("ishne");
        var path = temp.Path("layout.ecg");
        var options = IshneTestSignals.TwoLeadOptions();
        using (var writer = IshneWriter.Create(path, options))
        {
            writer.WriteDigital([100, -100, 200, -200, 300, -300]);
            writer.Complete();
        }

        var b = File.ReadAllBytes(path);
        var text = Encoding.ASCII.GetBytes(options.VariableBlockText);
        Assert.Equal("ISHNE1.0", Encoding.ASCII.GetString(b, 0, 8));
        Assert.Equal(text.Length, I32(b, 10));
        Assert.Equal(3, I32(b, 14));
        Assert.Equal(522, I32(b, 18));
        Assert.Equal(522 + text.Length, I32(b, 22));
        Assert.Equal(1, I16(b, 26));
        Assert.Equal("Tobiah", Field(b, 28, 40));
        Assert.Equal("Quillfeather", Field(b, 68, 40));
        Assert.Equal("NW-2026-0031", Field(b, 108, 20));
        Assert.Equal(1, I16(b, 128));
        Assert.Equal(0, I16(b, 130));
        Assert.Equal([2, 11, 1958], Shorts(b, 132, 3));
        Assert.Equal([4, 3, 2026], Shorts(b, 138, 3));
        Assert.Equal([6, 3, 2026], Shorts(b, 144, 3));
        Assert.Equal([8, 15, 30], Shorts(b, 150, 3));
        Assert.Equal(2, I16(b, 156));

        // Table 1: II = 6, V5 = 15; Table 2: good = 1, intermittent noise = 2; −9 marks the ten absent slots.
        Assert.Equal([6, 15, -9, -9, -9, -9, -9, -9, -9, -9, -9, -9], Shorts(b, 158, 12));
        Assert.Equal([1, 2, -9, -9, -9, -9, -9, -9, -9, -9, -9, -9], Shorts(b, 182, 12));
        Assert.Equal([2500, 5000, -9, -9, -9, -9, -9, -9, -9, -9, -9, -9], Shorts(b, 206, 12));
        Assert.Equal(0, I16(b, 230));
        Assert.Equal("digital", Field(b, 232, 40));
        Assert.Equal(200, I16(b, 272));
        Assert.Equal("Brackenfield Cardiology Clinic", Field(b, 274, 80));
        Assert.Equal("invented demo data", Field(b, 354, 80));
        Assert.All(b.AsSpan(434, 88).ToArray(), x => Assert.Equal(0, x));

        // The fixed block spans bytes 10–521: the ECG offset less the variable block leaves magic, checksum and 512 bytes.
        Assert.Equal(512, I32(b, 22) - I32(b, 10) - 10);
        Assert.Equal(options.VariableBlockText, Encoding.ASCII.GetString(b, 522, text.Length));

        // Appendix B: CRC over bytes 10 … ECG offset − 1; stored little-endian by this writer.
        var ecgOffset = I32(b, 22);
        Assert.Equal(IshneFileBuilder.CrcCcitt(b.AsSpan(10, ecgOffset - 10)), BinaryPrimitives.ReadUInt16LittleEndian(b.AsSpan(8)));

        Assert.Equal(ecgOffset + 3 * 2 * 2, b.Length);
        Assert.Equal([100, -100, 200, -200, 300, -300], Shorts(b, ecgOffset, 6));
    }

    [Fact]
    public void Writer_DisposedWithoutComplete_LeavesNoFile()
    {
        using var temp = new TempFolder("ishne");
        var path = temp.Path("abandoned.ecg");
        using (var writer = IshneWriter.Create(path, IshneTestSignals.TwoLeadOptions()))
        {
            writer.WriteDigital([1, 2, 3, 4]);
        }

        Assert.Empty(Directory.GetFiles(temp.FullPath));
    }

    [Fact]
    public void Writer_NameLongerThanField_IsRejected()
    {
        using var temp = new TempFolder("ishne");
        var options = IshneTestSignals.TwoLeadOptions() with { SubjectId = new string('7', 21) };
        Assert.Throws<ArgumentException>(() => IshneWriter.Create(temp.Path("long-id.ecg"), options));
        Assert.Empty(Directory.GetFiles(temp.FullPath));
    }

    private static int I32(byte[] b, int offset) => BinaryPrimitives.ReadInt32LittleEndian(b.AsSpan(offset));

    private static short I16(byte[] b, int offset) => BinaryPrimitives.ReadInt16LittleEndian(b.AsSpan(offset));

    private static short[] Shorts(byte[] b, int offset, int count)
    {
        var values = new short[count];
        for (var i = 0; i < count; i++)
        {
            values[i] = I16(b, offset + 2 * i);
        }

        return values;
    }

    private static string Field(byte[] b, int offset, int length)
    {
        var span = b.AsSpan(offset, length);
        var end = span.IndexOf((byte)0);
        Assert.True(end >= 0, $"text field at byte {offset} is not NUL-padded");
        Assert.All(span[end..].ToArray(), x => Assert.Equal(0, x));
        return Encoding.ASCII.GetString(span[..end]);
    }
}
