using System.Globalization;
using System.Text;
using LongRecord.Formats.Edf;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Edf;

/// <summary>
/// Writer → reader round trips. Expected samples are the synthetic input; the tolerance is one quantisation step
/// (the writer rounds to the nearest step, the reader's float arithmetic adds far less than a step).
/// </summary>
public sealed class EdfRoundTripTests : IDisposable
{
    private const int Rate = 250;
    private const int Seconds = 20;
    private readonly TempFolder _folder = new("edf-rt");

    public void Dispose() => _folder.Dispose();

    internal static float[][] ThreeLeadSignals() =>
    [
        EdfTestSignals.Make(Rate * Seconds, Rate, 2.0, seed: 1),
        EdfTestSignals.Make(Rate * Seconds, Rate, 1.5, seed: 2),
        EdfTestSignals.Make(Rate * Seconds, Rate, 1.0, seed: 3),
    ];

    internal static readonly RecordingEvent[] s_events =
    [
        new(0, null, "Recording start"),
        new(1.5, 2.25, "Patient button"),
        new(7.125, null, "Übelkeit – diary entry"),
        new(19.996, 0.004, "Lead off"),
    ];

    [Fact]
    public void SyntheticThreeLeads_SamplesWithinOneStep_EventsAndHeaderIdentical()
    {
        var path = _folder.Path("three.edf");
        var signals = ThreeLeadSignals();
        var options = EdfTestSignals.ThreeLeads();
        // Blocks of 333 samples do not align with the 250-sample records, so partial records are carried over.
        EdfTestSignals.Write(path, options, signals, 333, w =>
        {
            foreach (var e in s_events)
            {
                w.AddAnnotation(e.OnsetS, e.DurationS, e.Text);
            }
        });

        using var reader = EdfReader.Open(path);
        var info = reader.Info;
        Assert.Equal(RecordingFormat.Edf, info.Format);
        Assert.Equal("EDF+C", info.FormatDetail);
        Assert.Equal(s_events, info.Events);
        Assert.Empty(info.Gaps);
        Assert.Equal(Seconds, info.DurationS);
        Assert.Equal(options.Start, info.StartDateTime);
        Assert.Equal("LR-0042", info.Identification.PatientId);
        Assert.Equal("F", info.Identification.Sex);
        Assert.Equal("1961-08-02", info.Identification.BirthDate);
        Assert.Equal("Testperson Ada", info.Identification.PatientName);
        Assert.Equal("LR-0042 F 02-AUG-1961 Testperson_Ada", info.Identification.PatientField);
        Assert.Equal("Startdate 05-MAR-2024 HOLT-7 Tech_B Demo_recorder_3", info.Identification.RecordingField);

        for (var c = 0; c < 3; c++)
        {
            var written = options.Channels[c];
            var channel = info.Channels[c];
            Assert.Equal(written.Label, channel.Label);
            Assert.Equal(written.PhysicalUnit, channel.PhysicalUnit);
            Assert.Equal(written.Transducer, channel.Transducer);
            Assert.Equal(written.Prefilter, channel.Prefilter);
            Assert.Equal(Rate, channel.SamplingRateHz);
            Assert.Equal(Rate * Seconds, channel.SampleCount);
            Assert.Equal(-32768, channel.DigitalMin);
            Assert.Equal(32767, channel.DigitalMax);
            Assert.Equal(65535 / (written.PhysicalMax - written.PhysicalMin), channel.Gain, 9);

            var back = new float[channel.SampleCount];
            reader.Read(c, 0, back);
            var step = channel.Resolution;
            for (var i = 0; i < back.Length; i++)
            {
                Assert.True(Math.Abs(back[i] - signals[c][i]) <= step, $"channel {c} sample {i}: {back[i]} vs {signals[c][i]} (step {step})");
            }
        }
    }

    [Fact]
    public void HeaderFields_AreWrittenAsTheSpecLaysThemOut()
    {
        // EDF spec: fixed 256-byte header, ASCII, left-justified, space-padded; EDF+ 2.1: "EDF+C" in the reserved field,
        // annotation signal labelled "EDF Annotations" with digital −32768…32767 and physical −1…1.
        var path = _folder.Path("fields.edf");
        EdfTestSignals.Write(path, EdfTestSignals.ThreeLeads(), ThreeLeadSignals(), 1000);
        var h = File.ReadAllBytes(path);
        string F(int at, int width) => Encoding.ASCII.GetString(h, at, width);
        const int ns = 4;
        Assert.Equal("0       ", F(0, 8));
        Assert.Equal("05.03.24", F(168, 8));
        Assert.Equal("21.30.15", F(176, 8));
        Assert.Equal("1280    ", F(184, 8));
        Assert.Equal("EDF+C".PadRight(44), F(192, 44));
        Assert.Equal("20      ", F(236, 8));
        Assert.Equal("1       ", F(244, 8));
        Assert.Equal("4   ", F(252, 4));
        Assert.Equal("EDF Annotations ", F(256 + 3 * 16, 16));
        Assert.Equal("-3.2768 ", F(256 + ns * 104 + 8, 8));
        Assert.Equal("3.2767  ", F(256 + ns * 112 + 8, 8));
        Assert.Equal("-1      1       -32768  32767   ", F(256 + ns * 104 + 24, 8) + F(256 + ns * 112 + 24, 8) + F(256 + ns * 120 + 24, 8) + F(256 + ns * 128 + 24, 8));
        Assert.Equal("250     ", F(256 + ns * 216, 8));
        Assert.Equal(1280 + 20 * (3 * 500 + 128), h.Length);
    }

    [Fact]
    public void SubSecondStart_IsKeptInTheFirstTimeKeepingTal()
    {
        // EDF+ 2.2.4: the header time has 1-s resolution; the first record's time-keeping TAL carries the fraction.
        var path = _folder.Path("fraction.edf");
        var options = EdfTestSignals.ThreeLeads() with { Start = new DateTime(2024, 3, 5, 23, 59, 59, 750) };
        EdfTestSignals.Write(path, options, ThreeLeadSignals(), 500, w => w.AddAnnotation(2.5, null, "Mark"));
        var bytes = File.ReadAllBytes(path);
        Assert.Equal("23.59.59", Encoding.ASCII.GetString(bytes, 176, 8));
        Assert.Equal("+0.75\u0014\u0014\0", Encoding.ASCII.GetString(bytes, 1280 + 1500, 8));

        using var reader = EdfReader.Open(path);
        Assert.Equal(options.Start, reader.Info.StartDateTime);
        var mark = Assert.Single(reader.Info.Events);
        Assert.Equal(2.5, mark.OnsetS, 9);
    }

    [Fact]
    public void PartialLastRecord_IsPaddedWithTheDigitalMinimum()
    {
        var path = _folder.Path("pad.edf");
        var x = EdfTestSignals.Make(375, Rate, 1.0, seed: 9);
        var options = EdfTestSignals.ThreeLeads() with { Channels = [EdfTestSignals.ThreeLeads().Channels[0]] };
        EdfTestSignals.Write(path, options, [x], 375);
        using var reader = EdfReader.Open(path);
        Assert.Equal(500, reader.Info.Channels[0].SampleCount);
        var back = new float[500];
        reader.Read(0, 0, back);
        // Digital −32768 is physical minimum −5 mV.
        Assert.All(back[375..], v => Assert.Equal(-5f, v, 1e-5f));
    }

    [Fact]
    public void AnnotationsThatDoNotFit_SpillIntoLaterRecordsAndNoneIsLost()
    {
        var path = _folder.Path("spill.edf");
        var options = EdfTestSignals.ThreeLeads() with { AnnotationBytesPerRecord = 48 };
        var expected = Enumerable.Range(0, 60).Select(i => new RecordingEvent(0.5 + i * 0.001, null, $"Beat {i}")).ToArray();
        EdfTestSignals.Write(path, options, ThreeLeadSignals(), 250, w =>
        {
            foreach (var e in expected)
            {
                w.AddAnnotation(e.OnsetS, e.DurationS, e.Text);
            }
        });

        using var reader = EdfReader.Open(path);
        // 48 bytes hold the time-keeping TAL and at most two of these: 60 annotations outlast the 20 records, so
        // Complete adds padded records for the rest.
        Assert.Equal(expected.Select(e => (Math.Round(e.OnsetS, 6), e.Text)), reader.Info.Events.Select(e => (Math.Round(e.OnsetS, 6), e.Text)));
        Assert.True(reader.Info.DurationS > Seconds);
    }

    [Fact]
    public void AnnotationLongerThanTheReservedSpace_FailsClearly()
    {
        using var writer = new EdfWriter(_folder.Path("long.edf"), EdfTestSignals.ThreeLeads() with { AnnotationBytesPerRecord = 64 });
        var e = Assert.Throws<ArgumentException>(() => writer.AddAnnotation(1, null, new string('x', 60)));
        Assert.Contains("AnnotationBytesPerRecord", e.Message);
    }

    [Fact]
    public void DisposeWithoutComplete_LeavesNoFile()
    {
        var path = _folder.Path("abandoned.edf");
        using (var writer = new EdfWriter(path, EdfTestSignals.ThreeLeads()))
        {
            writer.WriteSamples(new float[3 * 500], 500);
        }

        Assert.Empty(Directory.GetFiles(_folder.FullPath));
    }

    [Fact]
    public void ChannelsOfDifferentRates_AppendedSeparately_ReadBack()
    {
        var path = _folder.Path("multirate.edf");
        var ecg = EdfTestSignals.Make(500 * 6, 500, 1.0, seed: 4);
        var resp = EdfTestSignals.Make(25 * 6, 25, 100, seed: 5);
        var options = EdfTestSignals.ThreeLeads() with
        {
            Channels =
            [
                new EdfWriterChannel { Label = "ECG", PhysicalMin = -5, PhysicalMax = 5, SamplesPerRecord = 500 },
                new EdfWriterChannel { Label = "Resp", PhysicalUnit = "%", PhysicalMin = -200, PhysicalMax = 200, SamplesPerRecord = 25 },
            ],
        };
        using (var writer = new EdfWriter(path, options))
        {
            writer.Append(1, resp);
            for (var s = 0; s < ecg.Length; s += 700)
            {
                writer.Append(0, ecg.AsSpan(s, Math.Min(700, ecg.Length - s)));
            }

            writer.Complete();
        }

        using var reader = EdfReader.Open(path);
        Assert.Equal([500.0, 25.0], reader.Info.Channels.Select(c => c.SamplingRateHz));
        Assert.Equal([3000L, 150L], reader.Info.Channels.Select(c => c.SampleCount));
        var back = new float[150];
        reader.Read(1, 0, back);
        // "%" is not a voltage, so values come back in the channel's own unit.
        Assert.All(back.Zip(resp), p => Assert.True(Math.Abs(p.First - p.Second) <= reader.Info.Channels[1].Resolution));
    }

    [Fact]
    public void YearAfter2084_IsWrittenAsYyAndReadFromTheStartdateSubfield()
    {
        // EDF+ 2.1.3.2: after 2084 the header's yy is the literal "yy"; the recording field's 4-digit year defines the date.
        var path = _folder.Path("future.edf");
        var options = EdfTestSignals.ThreeLeads() with { Start = new DateTime(2090, 7, 1, 8, 0, 0) };
        EdfTestSignals.Write(path, options, ThreeLeadSignals(), 5000);
        Assert.Equal("01.07.yy", Encoding.ASCII.GetString(File.ReadAllBytes(path), 168, 8));
        using var reader = EdfReader.Open(path);
        Assert.Equal(new DateOnly(2090, 7, 1), reader.Info.StartDate);
    }

    [Fact]
    public void InvalidOptions_AreAllReportedAtOnce()
    {
        var options = EdfTestSignals.ThreeLeads() with
        {
            Channels = [new EdfWriterChannel { Label = "A label far too long", PhysicalMin = 1, PhysicalMax = 1, SamplesPerRecord = 0 }],
            Start = new DateTime(1980, 1, 1),
        };
        var e = Assert.Throws<ArgumentException>(() => new EdfWriter(_folder.Path("bad.edf"), options));
        Assert.Contains("longer than 16", e.Message);
        Assert.Contains("physical minimum equals physical maximum", e.Message);
        Assert.Contains("samples per record must be positive", e.Message);
        Assert.Contains("before 1985", e.Message);
    }

    [Theory]
    [InlineData(-3.2768, "-3.2768")]
    [InlineData(1.0 / 3, "0.333333")]
    [InlineData(-1234.56789, "-1234.57")]
    [InlineData(12345678.0, "12345678")]
    [InlineData(0.00001, "0.00001")]
    public void Numbers_FitEightCharactersKeepingAllThePrecisionThatFits(double value, string expected) =>
        Assert.Equal(expected, EdfNumberText.Fit(value, 8));

    [Fact]
    public void Numbers_ThatCannotFit_AreRefused() => Assert.Null(EdfNumberText.Fit(-123456789.0, 8));

    internal static string F(double v) => v.ToString(CultureInfo.InvariantCulture);
}
