using System.Buffers.Binary;
using LongRecord.Formats.Ishne;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Ishne;

/// <summary>Files assembled byte by byte in the test (<see cref="IshneFileBuilder"/>) from Badilini 1998, Table 3.</summary>
public class IshneHandAssembledTests
{
    [Fact]
    public void HandAssembled_BigEndianChecksum_ReadsHeaderFields()
    {
        using var temp = new TempFolder("ishne");
        var path = temp.Write("hand.ecg", new IshneFileBuilder { ChecksumBigEndian = true }.Build());
        using var reader = IshneReader.Open(path);
        var info = reader.Info;

        Assert.Equal(RecordingFormat.Ishne, info.Format);
        Assert.True(reader.Header.ChecksumBigEndian);
        Assert.Equal(["II", "V5"], info.Channels.Select(c => c.Label));
        Assert.All(info.Channels, c => Assert.Equal(200.0, c.SamplingRateHz));
        Assert.All(info.Channels, c => Assert.Equal(4, c.SampleCount));
        Assert.Equal(4 / 200.0, info.DurationS, 12);
        Assert.Equal(new DateOnly(2026, 3, 4), info.StartDate);
        Assert.Equal(new TimeOnly(8, 15, 0), info.StartTime);
        Assert.Equal("Ilse Varenholt", info.Identification.PatientName);
        Assert.Equal("NW-0417", info.Identification.PatientId);
        Assert.Equal("F", info.Identification.Sex);
        Assert.Equal("1961-07-23", info.Identification.BirthDate);
        Assert.Contains("Brackenfield Cardiology Clinic", info.Identification.RecordingField);
        Assert.Contains("digital", info.Identification.RecordingField);
        Assert.Equal(["diary: walk 09:10", "slept 23:00"], info.Comments);
        Assert.Equal(new DateOnly(2026, 3, 5), reader.Header.FileDate);
        Assert.Equal([IshneLeadQuality.Good, IshneLeadQuality.IntermittentNoise], reader.Header.Leads.Select(l => l.Quality));
    }

    // Physical value = sample × resolution (Badilini 1998: amplitude resolution in nV per unit); −32 768 marks lead fault.
    [Fact]
    public void HandAssembled_SamplesAreValueTimesResolution_LeadFaultIsNaN()
    {
        using var temp = new TempFolder("ishne");
        var path = temp.Write("hand.ecg", new IshneFileBuilder().Build());
        using var reader = IshneReader.Open(path);
        var lead1 = new float[4];
        var lead2 = new float[4];
        reader.Read(0, 0, lead1);
        reader.Read(1, 0, lead2);

        // Lead 1 samples 400, 0, −32768, 1 at 2 500 nV; lead 2 samples −200, 32767, −32767, −1 at 5 000 nV.
        Assert.Equal(400 * 2500e-6, lead1[0], 6);
        Assert.Equal(0.0, lead1[1], 6);
        Assert.True(float.IsNaN(lead1[2]));
        Assert.Equal(1 * 2500e-6, lead1[3], 9);
        Assert.Equal(-200 * 5000e-6, lead2[0], 6);
        Assert.Equal(32767 * 5000e-6, lead2[1], 4);
        Assert.Equal(-32767 * 5000e-6, lead2[2], 4);
        Assert.Equal(-1 * 5000e-6, lead2[3], 9);
    }

    [Fact]
    public void HandAssembled_LittleEndianChecksum_IsAccepted()
    {
        using var temp = new TempFolder("ishne");
        var path = temp.Write("hand-le.ecg", new IshneFileBuilder { ChecksumBigEndian = false }.Build());
        using var reader = IshneReader.Open(path);
        Assert.False(reader.Header.ChecksumBigEndian);
    }

    [Fact]
    public void HandAssembled_WrongChecksum_IsRejectedAtByte8()
    {
        using var temp = new TempFolder("ishne");
        var bytes = new IshneFileBuilder { ChecksumBigEndian = true }.Build();
        var good = BinaryPrimitives.ReadUInt16BigEndian(bytes.AsSpan(8));
        BinaryPrimitives.WriteUInt16BigEndian(bytes.AsSpan(8), (ushort)(good ^ 0x0100));
        var path = temp.Write("bad-crc.ecg", bytes);

        var e = Assert.Throws<RecordingFormatException>(() => IshneReader.Open(path));
        Assert.Equal(8, e.ByteOffset);
        Assert.Contains($"computed 0x{good:X4}", e.Message);
    }

    [Fact]
    public void HandAssembled_UnknownAndDuplicateLeadCodes_GetPositionLabels()
    {
        using var temp = new TempFolder("ishne");
        var builder = new IshneFileBuilder
        {
            LeadCodes = [1, 1, 0, 42],
            Resolutions = [2500, 2500, 2500, 2500],
            Qualities = [0, 0, 0, 0],
            Samples = [1, 2, 3, 4],
        };
        using var reader = IshneReader.Open(temp.Write("codes.ecg", builder.Build()));
        Assert.Equal(["generic bipolar (lead 1)", "generic bipolar (lead 2)", "lead 3", "lead 4"], reader.Info.Channels.Select(c => c.Label));
    }

    [Fact]
    public void HandAssembled_UnknownDatesAndTime_AreNull()
    {
        using var temp = new TempFolder("ishne");
        var builder = new IshneFileBuilder { BirthDate = [-9, -9, -9], RecordingDate = [0, 0, 0], StartTime = [-9, -9, -9], Sex = 0 };
        using var reader = IshneReader.Open(temp.Write("unknown.ecg", builder.Build()));
        Assert.Null(reader.Info.StartDate);
        Assert.Null(reader.Info.StartTime);
        Assert.Null(reader.Info.Identification.BirthDate);
        Assert.Null(reader.Info.Identification.Sex);
    }

    // The header's sample count is authoritative: bytes after the declared samples (padding by some writers) are not read.
    [Fact]
    public void HandAssembled_BytesAfterDeclaredSamples_AreIgnored()
    {
        using var temp = new TempFolder("ishne");
        var bytes = new IshneFileBuilder().Build();
        var padded = bytes.Concat(new byte[] { 0x11, 0x22, 0x33 }).ToArray();
        using var reader = IshneReader.Open(temp.Write("padded.ecg", padded));
        Assert.Equal(4, reader.Info.Channels[0].SampleCount);
    }

    [Fact]
    public void HandAssembled_ZeroSamples_IsAnEmptyRecording()
    {
        using var temp = new TempFolder("ishne");
        using var reader = IshneReader.Open(temp.Write("empty.ecg", new IshneFileBuilder { Samples = [] }.Build()));
        Assert.Equal(0, reader.Info.Channels[0].SampleCount);
        Assert.Equal(0.0, reader.Info.DurationS);
        reader.Read(0, 0, Span<float>.Empty);
    }

    [Fact]
    public void Sniff_RecognisesMagicOnly()
    {
        Assert.True(IshneReader.Sniff("ISHNE1.0\0\0"u8));
        Assert.False(IshneReader.Sniff("ANN  1.0\0\0"u8));
        Assert.False(IshneReader.Sniff("ISHNE1"u8));
    }
}
