using System.Text;
using LongRecord.Formats.Edf;
using LongRecord.TestSupport;
using static LongRecord.Formats.Tests.Edf.EdfHandAssembly;

namespace LongRecord.Formats.Tests.Edf;

/// <summary>Header rules of EDF (Kemp et al. 1992) and EDF+ (Kemp and Olivan 2003) on hand-assembled files.</summary>
public sealed class EdfHeaderTests : IDisposable
{
    private readonly TempFolder _folder = new("edf-header");

    public void Dispose() => _folder.Dispose();

    [Theory]
    [InlineData("12.08.85", 1985)]
    [InlineData("12.08.99", 1999)]
    [InlineData("12.08.00", 2000)]
    [InlineData("12.08.84", 2084)]
    public void PlainEdf_TwoDigitYear_UsesThe1985ClippingDate(string date, int year)
    {
        // EDF (edfplus.info, "EDF and the year 2000"): yy 85–99 are 1985–1999, 00–84 are 2000–2084.
        using var reader = EdfReader.Open(Plain(date, "1"));
        Assert.Equal(new DateOnly(year, 8, 12), reader.Info.StartDate);
        Assert.Equal("EDF", reader.Info.FormatDetail);
    }

    [Fact]
    public void PlainEdf_PatientFieldIsKeptRawNotParsedAsEdfPlus()
    {
        using var reader = EdfReader.Open(Plain("12.08.09", "1", patient: "MCH-0234567 F 02-MAY-1951 Haagse_Harry"));
        Assert.Equal("MCH-0234567 F 02-MAY-1951 Haagse_Harry", reader.Info.Identification.PatientField);
        Assert.Null(reader.Info.Identification.PatientId);
        Assert.Null(reader.Info.Identification.PatientName);
    }

    [Fact]
    public void EdfPlus_PatientSubfields_AreParsed_XMeansUnknown()
    {
        // EDF+ 2.1.3.3: "code sex birthdate name", unknown subfields "X", spaces in the name written as '_'.
        var bytes = Build("EDF+C", "12.08.09", "10.00.00", "1", [new("ECG", 4), new("EDF Annotations", 8)],
            [new DataRecord([[1, 2, 3, 4]], "+0\u0014\u0014\0")], patient: "X M 02-MAY-1951 Demo_Patient_Two",
            recording: "Startdate 12-AUG-2009 X X X");
        using var reader = EdfReader.Open(_folder.Write("plus.edf", bytes));
        var id = reader.Info.Identification;
        Assert.Null(id.PatientId);
        Assert.Equal("M", id.Sex);
        Assert.Equal("1951-05-02", id.BirthDate);
        Assert.Equal("Demo Patient Two", id.PatientName);
    }

    [Fact]
    public void EdfPlus_FourDigitStartdateSubfield_WinsOverTheHeaderYear()
    {
        // EDF+ 2.1.3.2: the recording field's "Startdate 12-AUG-2009" holds the 4-digit year.
        var bytes = Build("EDF+C", "12.08.09", "10.00.00", "1", [new("ECG", 4), new("EDF Annotations", 8)],
            [new DataRecord([[1, 2, 3, 4]], "+0\u0014\u0014\0")], recording: "Startdate 12-AUG-1909 X X X");
        using var reader = EdfReader.Open(_folder.Write("year.edf", bytes));
        Assert.Equal(new DateOnly(1909, 8, 12), reader.Info.StartDate);
    }

    [Fact]
    public void UnknownRecordCount_IsTakenFromTheFileSize()
    {
        // EDF: "number of data records (-1 if unknown)"; three whole records follow the header.
        using var reader = EdfReader.Open(Plain("01.01.24", "1", recordCount: "-1", records: 3));
        Assert.Equal(12, reader.Info.Channels[0].SampleCount);
        Assert.Equal(3.0, reader.Info.DurationS);
    }

    [Fact]
    public void ZeroRecordDuration_WithASampledSignal_IsRefused()
    {
        var e = Assert.Throws<RecordingFormatException>(() => EdfReader.Open(Plain("01.01.24", "0")));
        Assert.Contains("'duration of a data record' is 0", e.Message);
        Assert.Equal(244, e.ByteOffset);
    }

    [Fact]
    public void EdfPlusD_RecordWithoutTimeKeeping_IsRefusedNamingTheRecord()
    {
        var bytes = Build("EDF+D", "01.01.24", "10.00.00", "1", [new("ECG", 4), new("EDF Annotations", 8)],
            [new DataRecord([[1, 2, 3, 4]], "+0\u0014\u0014\0"), new DataRecord([[1, 2, 3, 4]], "")]);
        var e = Assert.Throws<RecordingFormatException>(() => EdfReader.Open(_folder.Write("notk.edf", bytes)));
        Assert.Contains("data record 2 of an EDF+D file has no time-keeping TAL", e.Message);
        Assert.Equal(256 * 3 + (8 + 16) + 8, e.ByteOffset); // header, record 1, then record 2's ECG samples
    }

    [Fact]
    public void EdfPlusD_OverlappingRecords_AreRefused()
    {
        // EDF+ 2.2.4: records are in time order; a record may not start before the previous one ends.
        var bytes = Build("EDF+D", "01.01.24", "10.00.00", "1", [new("ECG", 4), new("EDF Annotations", 8)],
            [new DataRecord([[1, 2, 3, 4]], "+0\u0014\u0014\0"), new DataRecord([[1, 2, 3, 4]], "+0.5\u0014\u0014\0")]);
        var e = Assert.Throws<RecordingFormatException>(() => EdfReader.Open(_folder.Write("overlap.edf", bytes)));
        Assert.Contains("data record 2 starts at +0.5 s, before data record 1 ends (+1 s)", e.Message);
    }

    [Fact]
    public void EdfPlusD_TimeKeepingWithoutTheEmptyAnnotation_IsStillTimeKeeping()
    {
        // "+onset 0x14 0x00" instead of EDF+ 2.2.4's "+onset 0x14 0x14 0x00": accepted (common practice, no source).
        var bytes = Build("EDF+D", "01.01.24", "10.00.00", "1", [new("ECG", 4), new("EDF Annotations", 8)],
            [new DataRecord([[1, 2, 3, 4]], "+0\u0014\0"), new DataRecord([[1, 2, 3, 4]], "+3\u0014\0")]);
        using var reader = EdfReader.Open(_folder.Write("short-tk.edf", bytes));
        Assert.Equal([new RecordingGap(1, 2)], reader.Info.Gaps);
        Assert.Empty(reader.Info.Events);
    }

    [Fact]
    public void Sniff_RecognisesEdfAndBdfHeadsOfAnyLength_AndNothingElse()
    {
        var path = _folder.Path("w.edf");
        EdfTestSignals.Write(path, EdfTestSignals.ThreeLeads(), EdfRoundTripTests.ThreeLeadSignals(), 5000);
        var edf = File.ReadAllBytes(path);
        var bdfPath = _folder.Path("w.bdf");
        EdfTestSignals.Write(bdfPath, EdfTestSignals.ThreeLeads(bdf: true), EdfRoundTripTests.ThreeLeadSignals(), 5000);
        var bdf = File.ReadAllBytes(bdfPath);

        foreach (var length in new[] { 8, 100, 180, 256, 2000 })
        {
            Assert.True(EdfReader.Sniff(edf.AsSpan(0, length)), $"EDF head of {length} bytes");
            Assert.True(EdfReader.Sniff(bdf.AsSpan(0, length)), $"BDF head of {length} bytes");
        }

        Assert.False(EdfReader.Sniff(edf.AsSpan(0, 7)));
        Assert.False(EdfReader.Sniff("ISHNE1.0\0\0\0\0"u8));
        Assert.False(EdfReader.Sniff("100 2 360 650000 0:0:0 0/0/0\n"u8));
        Assert.False(EdfReader.Sniff(Encoding.ASCII.GetBytes("time,ECG I,ECG II\n0,0.1,0.2\n".PadRight(300))));
    }

    private string Plain(string date, string durationS, string patient = "X", string? recordCount = null, int records = 1)
    {
        var data = Enumerable.Range(0, records).Select(r => new DataRecord([[(short)r, 2, 3, 4]], "")).ToArray();
        var bytes = Build("", date, "10.00.00", durationS, [new SignalSpec("ECG", 4)], data, recordCount, patient, recording: "X");
        return _folder.Write($"plain-{Guid.NewGuid():N}.edf", bytes);
    }
}
