using System.Text;
using LongRecord.Formats.Edf;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Edf;

/// <summary>
/// BDF (BioSemi's 24-bit EDF): version field 0xFF "BIOSEMI", samples 3-byte little-endian two's complement; BDF+C marks
/// the reserved field and labels the annotation signal "BDF Annotations".
/// </summary>
public sealed class EdfBdfTests : IDisposable
{
    // 1 µV steps over the full 24-bit range: digital −8388608…8388607 ↔ physical −8388608…8388607 µV (the header's
    // 8-character fields can hold these in µV, not as −8388.608 mV). Samples go in and come out in mV.
    private const double PhysMinUv = -8388608;
    private const double PhysMaxUv = 8388607;
    private const double PhysMin = PhysMinUv / 1000;
    private const double PhysMax = PhysMaxUv / 1000;

    private static readonly float[] s_values =
    [
        (float)PhysMin, -8388.607f, -1234.567f, -1f, -0.001f, 0f, 0.001f, 1f, 4321.001f, (float)PhysMax, 9000f, -9000f,
    ];

    private readonly TempFolder _folder = new("bdf");

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void TwentyFourBitValues_IncludingNegativesAndExtremes_RoundTrip()
    {
        var path = Write();
        using var reader = EdfReader.Open(path);
        Assert.Equal(RecordingFormat.Bdf, reader.Info.Format);
        Assert.Equal("BDF+C", reader.Info.FormatDetail);
        var channel = reader.Info.Channels[0];
        Assert.Equal(-8388608, channel.DigitalMin);
        Assert.Equal(8388607, channel.DigitalMax);

        // The annotation came after the first record was written, so Complete put it in an extra, padded record.
        Assert.Equal("Extremes", Assert.Single(reader.Info.Events).Text);
        Assert.Equal(2 * s_values.Length, channel.SampleCount);

        var back = new float[s_values.Length];
        reader.Read(0, 0, back);
        for (var i = 0; i < s_values.Length; i++)
        {
            // Beyond the physical range the writer saturates at the digital limits.
            var expected = Math.Clamp(s_values[i], PhysMin, PhysMax);
            // One step (0.001 mV): the writer rounds to the nearest step and float carries 24 bits, so near ±8388 mV
            // float spacing (≈0.001 mV) is the same size as the step.
            Assert.True(Math.Abs(back[i] - expected) <= channel.Resolution, $"value {i}: {back[i]} vs {expected}");
        }
    }

    [Fact]
    public void TwentyFourBitSamples_AreStoredAsThreeByteLittleEndianTwosComplement()
    {
        var bytes = File.ReadAllBytes(Write());
        Assert.Equal(0xFF, bytes[0]);
        Assert.Equal("BIOSEMI", Encoding.ASCII.GetString(bytes, 1, 7));
        Assert.Equal("BDF+C", Encoding.ASCII.GetString(bytes, 192, 5));
        Assert.Equal("BDF Annotations ", Encoding.ASCII.GetString(bytes, 256 + 16, 16));

        const int dataStart = 256 * 3;
        for (var i = 0; i < s_values.Length; i++)
        {
            // EDF spec mapping, computed here: digital = round((v − physMin) × (digMax − digMin) / (physMax − physMin) + digMin).
            var digital = (int)Math.Clamp(Math.Round((s_values[i] * 1000.0 - PhysMinUv) * 16777215.0 / (PhysMaxUv - PhysMinUv) - 8388608), -8388608, 8388607);
            var stored = bytes[dataStart + 3 * i] | (bytes[dataStart + 3 * i + 1] << 8) | (bytes[dataStart + 3 * i + 2] << 16);
            Assert.Equal(digital & 0xFFFFFF, stored);
        }

        // Spot checks of the encoding itself: −8388608 = 00 00 80, −1 = FF FF FF, 8388607 = FF FF 7F.
        Assert.Equal([0x00, 0x00, 0x80], bytes[dataStart..(dataStart + 3)]);
        Assert.Equal([0xFF, 0xFF, 0xFF], bytes[(dataStart + 12)..(dataStart + 15)]);
        Assert.Equal([0xFF, 0xFF, 0x7F], bytes[(dataStart + 27)..(dataStart + 30)]);
    }

    private string Write()
    {
        var path = _folder.Path("values.bdf");
        var options = EdfTestSignals.ThreeLeads(bdf: true) with
        {
            Channels = [new EdfWriterChannel { Label = "ECG", PhysicalUnit = "uV", PhysicalMin = PhysMinUv, PhysicalMax = PhysMaxUv, SamplesPerRecord = s_values.Length }],
        };
        using var writer = new EdfWriter(path, options);
        writer.WriteSamples(s_values, s_values.Length);
        writer.AddAnnotation(0.5, null, "Extremes");
        writer.Complete();
        return path;
    }
}
