using System.Globalization;
using System.Text;
using LongRecord.Formats.Edf;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Edf;

/// <summary>The reader on the two open EDF+ files in the shared data folder, checked against their READMEs and raw bytes.</summary>
public sealed class EdfSharedDataTests
{
    // eegmmidb S001R01 layout (physionet/eegmmidb/README.md: 64 EEG channels + "EDF Annotations", 61 records of 1 s, 160 Hz).
    private const int EegChannels = 64;
    private const int HeaderBytes = 256 * (EegChannels + 2);
    private const int RecordBytes = EegChannels * 160 * 2 + 80 * 2;

    [Fact]
    public void TestEdfAnn_Has856AnnotationsAndNoSampledChannel()
    {
        // Source: edf/wfdb-python-samples/README.md and physionet/SOURCES.md: "EDF+C holding only an 'EDF Annotations'
        // signal: 856 annotations (sleep stages ... 30 s each, plus 'Lights off')".
        var path = SharedData.Path("edf/wfdb-python-samples/test_edfann.edf");
        using var reader = EdfReader.Open(path);
        var info = reader.Info;

        Assert.Equal("EDF+C", info.FormatDetail);
        Assert.Equal(856, info.Events.Count);
        Assert.Empty(info.Channels);
        Assert.False(info.HasSignal);
        Assert.Contains("data record duration 0", info.NoSignalReason);
        Assert.Equal(0.0, ReadDurationField(path));
        // README: sleep stages of 30 s and one "Lights off"; the recording's extent is the end of the last 30-s stage.
        Assert.Single(info.Events, e => e.Text.StartsWith("Lights off", StringComparison.Ordinal));
        Assert.All(info.Events.Where(e => e.Text.StartsWith("Sleep stage", StringComparison.Ordinal)), e => Assert.Equal(30.0, e.DurationS));
        Assert.Equal(info.Events.Max(e => e.OnsetS + (e.DurationS ?? 0)), info.DurationS);
        Assert.Equal(new DateTime(2001, 1, 1, 23, 59, 30), info.StartDateTime);
    }

    [Fact]
    public void S001R01_AsStored_IsJudgedByItsLineEnds()
    {
        // The shared copy of S001R01.edf has had every LF byte turned into CR LF (git line-end conversion, as the README
        // says happened to R03/R04), then been cut to the declared size: 5,525 CR LF pairs and no lone LF. The first TAL
        // then sits 109 bytes (the CR bytes before it) past where the header puts the annotation signal of record 1.
        var path = Path.Combine(SharedData.Physionet("eegmmidb"), "S001R01.edf");
        var bytes = File.ReadAllBytes(path);
        var annotationStart = HeaderBytes + EegChannels * 320;
        if (CountCrLf(bytes) == Count(bytes, (byte)'\n'))
        {
            var e = Assert.Throws<RecordingFormatException>(() => EdfReader.Open(path));
            Assert.Equal($"{path}: bad TAL in data record 1: onset must begin with '+' or '-' (found 0x{bytes[annotationStart]:X2}) at byte {annotationStart}", e.Message);
            var tal = bytes.AsSpan().IndexOf("+0\u0014\u0014"u8);
            Assert.Equal(annotationStart + CountCrLf(bytes.AsSpan(0, tal)), tal);
        }
        else
        {
            using var reader = EdfReader.Open(path);
            Assert.Equal("T0", Assert.Single(reader.Info.Events).Text);
        }
    }

    [Fact]
    public void S001R01_LineEndsRestored_Has64EegChannelsAt160HzAndT0()
    {
        // README: 64 EEG channels + "EDF Annotations", 160 Hz, one annotation "T0" at 0 s.
        using var folder = new TempFolder("s001r01");
        var bytes = Restored(Path.Combine(SharedData.Physionet("eegmmidb"), "S001R01.edf"));
        var path = folder.Write("S001R01.edf", bytes);
        using var reader = EdfReader.Open(path);
        var info = reader.Info;

        Assert.Equal("EDF+C", info.FormatDetail);
        // The header holds 65 signals; the 65th is the annotation signal, which is not a channel.
        Assert.Equal("65  ", Encoding.ASCII.GetString(bytes, 252, 4));
        Assert.Equal("EDF Annotations ", Encoding.ASCII.GetString(bytes, 256 + 64 * 16, 16));
        Assert.Equal(EegChannels, info.Channels.Count);
        Assert.All(info.Channels, c => Assert.Equal(160.0, c.SamplingRateHz));
        Assert.Equal("Fc5.", info.Channels[0].Label);
        Assert.Equal("Iz..", info.Channels[63].Label);
        var t0 = Assert.Single(info.Events);
        Assert.Equal("T0", t0.Text);
        Assert.Equal(0.0, t0.OnsetS);
        // Recording field "Startdate 12-AUG-2009 …" and header start time 16.15.00.
        Assert.Equal(new DateTime(2009, 8, 12, 16, 15, 0), info.StartDateTime);
    }

    [Theory]
    [InlineData(0, 0)]
    [InlineData(0, 1)]
    [InlineData(5, 159)]
    [InlineData(31, 2000)]
    [InlineData(63, 9599)]
    public void S001R01_SamplesMatchHeaderArithmeticOnRawBytes(int channel, int sample)
    {
        // Independent decoding (EDF spec): physical = physMin + (digital − digMin) × (physMax − physMin) / (digMax − digMin),
        // with the header fields and the 2-byte little-endian sample read here from the raw bytes; uV → mV.
        using var folder = new TempFolder("s001r01");
        var bytes = Restored(Path.Combine(SharedData.Physionet("eegmmidb"), "S001R01.edf"));
        var path = folder.Write("S001R01.edf", bytes);
        const int ns = EegChannels + 1;
        double Field(int fieldStart, int width) =>
            double.Parse(Encoding.ASCII.GetString(bytes, fieldStart + channel * width, width).Trim(), CultureInfo.InvariantCulture);
        var physMin = Field(256 + ns * 104, 8);
        var physMax = Field(256 + ns * 112, 8);
        var digMin = Field(256 + ns * 120, 8);
        var digMax = Field(256 + ns * 128, 8);
        var at = HeaderBytes + (sample / 160) * RecordBytes + channel * 320 + (sample % 160) * 2;
        var digital = (short)(bytes[at] | (bytes[at + 1] << 8));
        var expectedMv = (physMin + (digital - digMin) * (physMax - physMin) / (digMax - digMin)) * 1e-3;

        using var reader = EdfReader.Open(path);
        var actual = new float[1];
        reader.Read(channel, sample, actual);
        // Tolerance: float rounding of a value below 10 mV (2^-20 mV ≈ 1e-6 mV), far under the 0.001-mV step.
        Assert.Equal(expectedMv, actual[0], 1e-6);
    }

    /// <summary>
    /// The original bytes of S001R01.edf: CR LF pairs turned back into LF, then the records still complete (60 of 61 when
    /// the shared copy is damaged) with the record count set to match. An intact copy is returned as it is.
    /// </summary>
    private static byte[] Restored(string path)
    {
        var stored = File.ReadAllBytes(path);
        if (CountCrLf(stored) != Count(stored, (byte)'\n'))
        {
            return stored;
        }

        var restored = new List<byte>(stored.Length);
        for (var i = 0; i < stored.Length; i++)
        {
            if (!(stored[i] == '\r' && i + 1 < stored.Length && stored[i + 1] == '\n'))
            {
                restored.Add(stored[i]);
            }
        }

        var records = (restored.Count - HeaderBytes) / RecordBytes;
        var bytes = restored.GetRange(0, HeaderBytes + records * RecordBytes).ToArray();
        Encoding.ASCII.GetBytes(records.ToString(CultureInfo.InvariantCulture).PadRight(8), bytes.AsSpan(236, 8));
        return bytes;
    }

    private static double ReadDurationField(string path)
    {
        var head = new byte[256];
        using var f = File.OpenRead(path);
        f.ReadExactly(head);
        return double.Parse(Encoding.ASCII.GetString(head, 244, 8).Trim(), CultureInfo.InvariantCulture);
    }

    private static int CountCrLf(ReadOnlySpan<byte> bytes)
    {
        var n = 0;
        for (var i = 0; i + 1 < bytes.Length; i++)
        {
            if (bytes[i] == '\r' && bytes[i + 1] == '\n')
            {
                n++;
            }
        }

        return n;
    }

    private static int Count(ReadOnlySpan<byte> bytes, byte value) => bytes.Count(value);
}
