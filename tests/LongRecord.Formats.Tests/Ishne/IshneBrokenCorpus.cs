using System.Buffers.Binary;
using System.Text;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Ishne;

/// <summary>
/// Damaged ISHNE files made from a good hand-assembled one (<see cref="IshneFileBuilder"/>). Each damage that the checksum
/// would otherwise catch first is followed by a fresh checksum, so the reader must find the damaged field itself.
/// Offsets are those of Badilini 1998, Table 3.
/// </summary>
public static class IshneBrokenCorpus
{
    public static IEnumerable<BrokenFile> Build()
    {
        yield return Patched("ishne-wrong-magic-annotation-file", b => Encoding.ASCII.GetBytes("ANN  1.0").CopyTo(b, 0), reseal: false,
            "not an ISHNE Holter file: magic number 'ANN  1.0'", 0);
        yield return Patched("ishne-wrong-magic-version", b => b[7] = (byte)'1', reseal: false, "magic number 'ISHNE1.1', expected 'ISHNE1.0'", 0);

        // A name byte changed after the checksum was stored, in each of the two byte orders the reader accepts.
        var good = Good().Build();
        var goodLittle = BinaryPrimitives.ReadUInt16LittleEndian(good.AsSpan(8));
        yield return Patched("ishne-checksum-mismatch-little-endian", b => b[30] ^= 0x20, reseal: false,
            $"header checksum mismatch: stored 0x{goodLittle:X4}", 8);
        var bigBytes = new IshneFileBuilder { ChecksumBigEndian = true }.Build();
        var storedAsLittle = BinaryPrimitives.ReadUInt16LittleEndian(bigBytes.AsSpan(8));
        bigBytes[30] ^= 0x20;
        yield return new BrokenFile("ishne-checksum-mismatch-big-endian", "ishne-checksum-mismatch-big-endian.ecg", bigBytes,
            $"header checksum mismatch: stored 0x{storedAsLittle:X4}", 8);

        yield return new BrokenFile("ishne-truncated-fixed-block", "ishne-truncated-fixed-block.ecg", good[..300],
            "file ends inside the fixed-length header block (needs 522 bytes, has 300)", 300);

        var longText = new IshneFileBuilder { VariableText = new string('x', 200) }.Build();
        yield return new BrokenFile("ishne-truncated-variable-block", "ishne-truncated-variable-block.ecg", longText[..600],
            "file ends inside the variable-length block (needs 200 bytes, has 78)", 600);

        var ecg = Good().EcgOffset;
        yield return Patched("ishne-ecg-offset-inconsistent", b => I32(b, 22, ecg + 2), reseal: true,
            $"offset of the ECG block is {ecg + 2}, expected 522 + variable-length block size", 22);
        yield return Patched("ishne-variable-block-offset-not-522", b => I32(b, 18, 512), reseal: true,
            "offset of the variable-length block is 512, expected 522", 18);
        yield return Patched("ishne-negative-variable-block-size", b => I32(b, 10, -4), reseal: false,
            "size of the variable-length block -4 is outside", 10);
        yield return Patched("ishne-zero-leads", b => I16(b, 156, 0), reseal: true, "no leads: number of stored leads is 0", 156);
        yield return Patched("ishne-thirteen-leads", b => I16(b, 156, 13), reseal: true, "number of stored leads 13 is outside 1–12", 156);
        yield return Patched("ishne-zero-sampling-rate", b => I16(b, 272, 0), reseal: true, "sampling rate 0 Hz is not positive", 272);
        yield return Patched("ishne-negative-sampling-rate", b => I16(b, 272, -250), reseal: true, "sampling rate -250 Hz is not positive", 272);
        yield return Patched("ishne-zero-resolution", b => I16(b, 208, 0), reseal: true, "amplitude resolution of lead 2 is 0 nV, must be positive", 208);
        yield return Patched("ishne-negative-resolution", b => I16(b, 206, -2500), reseal: true, "amplitude resolution of lead 1 is -2500 nV", 206);
        yield return Patched("ishne-negative-samples-per-lead", b => I32(b, 14, -1), reseal: true, "number of samples per lead -1 is negative", 14);

        // The good file holds 4 frames of 2 leads; declaring 1 000 needs 522 + text + 4 000 bytes.
        yield return Patched("ishne-declared-samples-beyond-file", b => I32(b, 14, 1000), reseal: true,
            $"file ends before the 1000 samples per lead declared at byte 14 (needs {ecg + 4000} bytes for 2 leads, has {good.Length})", good.Length);
        yield return Patched("ishne-recording-date-not-a-date", b => { I16(b, 138, 31); I16(b, 140, 2); }, reseal: true,
            "date of recording 31/2/2026 (day/month/year) is not a calendar date", 138);
        yield return Patched("ishne-start-time-not-a-time", b => I16(b, 150, 25), reseal: true, "start time 25:15:0 is not a clock time", 150);
    }

    private static IshneFileBuilder Good() => new();

    private static BrokenFile Patched(string name, Action<byte[]> damage, bool reseal, string problem, long? offset)
    {
        var bytes = Good().Build();
        damage(bytes);
        if (reseal)
        {
            IshneFileBuilder.Seal(bytes, bigEndian: false);
        }

        return new BrokenFile(name, name + ".ecg", bytes, problem, offset);
    }

    private static void I16(byte[] b, int offset, short value) => BinaryPrimitives.WriteInt16LittleEndian(b.AsSpan(offset), value);

    private static void I32(byte[] b, int offset, int value) => BinaryPrimitives.WriteInt32LittleEndian(b.AsSpan(offset), value);
}
