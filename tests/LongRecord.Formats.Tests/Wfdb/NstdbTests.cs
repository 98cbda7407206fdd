using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>MIT-BIH Noise Stress Test Database (PhysioNet nstdb 1.0.0), partial copy.</summary>
public class NstdbTests
{
    private static string Nstdb(string file) => Path.Combine(SharedData.Physionet("nstdb"), file);

    [Fact]
    public void AllRecords_ReadFully_SamplesMatchHeaderChecksums()
    {
        // Source: nstdb README (7 records; "for all 7 records the 16-bit sample checksum and the first-sample value
        // stored in the header match the .dat for both signals"; 118e12, bw and ma are format 212, the others 16).
        var formats = new Dictionary<string, string>
        {
            ["118e00"] = "WFDB (format 16)", ["118e06"] = "WFDB (format 16)", ["118e12"] = "WFDB (format 212)",
            ["118e24"] = "WFDB (format 16)", ["118e_6"] = "WFDB (format 16)", ["bw"] = "WFDB (format 212)", ["ma"] = "WFDB (format 212)",
        };
        Assert.Equal(formats.Keys.Order(), SharedData.Records("nstdb"));
        foreach (var record in SharedData.Records("nstdb"))
        {
            using var reader = WfdbRecordReader.Open(Nstdb(record));
            Assert.Equal(formats[record], reader.Info.FormatDetail);
            Assert.Equal(2 * 650000, WfdbReferenceChecks.AssertSamplesMatchHeaderChecksums(reader));
        }
    }

    [Fact]
    public void NoiseStressRecords_HaveBaselineDifferentFromAdcZero()
    {
        // Source: nstdb/118e*.hea: "200(1024) 11 0" (baseline 1024, ADC zero 0); bw.hea and ma.hea: gain 0 (header(5):
        // uncalibrated, 200 assumed) and no baseline (header(5): equal to the ADC zero, 0).
        foreach (var record in new[] { "118e00", "118e06", "118e12", "118e24", "118e_6" })
        {
            using var reader = WfdbRecordReader.Open(Nstdb(record));
            Assert.All(reader.Header.Signals, s => Assert.Equal((1024, 0), (s.Baseline!.Value, s.AdcZero)));
            Assert.All(reader.Info.Channels, c => Assert.Equal((200.0, 1024.0), (c.Gain, c.Baseline)));
        }

        foreach (var record in new[] { "bw", "ma" })
        {
            using var reader = WfdbRecordReader.Open(Nstdb(record));
            Assert.All(reader.Header.Signals, s => Assert.Equal((0.0, (int?)null), (s.AdcGain, s.Baseline)));
            Assert.All(reader.Info.Channels, c => Assert.Equal((200.0, 0.0), (c.Gain, c.Baseline)));
        }
    }

    [Theory]
    [InlineData(0)]
    [InlineData(200001)]
    [InlineData(649999)]
    public void Record118e24_Format16_PhysicalUsesBaselineNotAdcZero(long frame)
    {
        // signal(5) format 16 worked by hand (two's complement, low byte first); header(5): physical =
        // (digital − baseline) / gain with baseline 1024, not the ADC zero 0. Tolerance 1e-4 mV: float rounding.
        var raw = RawBytes("118e24.dat", frame * 4, 4);
        var d0 = raw[0] + 256 * raw[1];
        var d1 = raw[2] + 256 * raw[3];
        d0 = d0 >= 32768 ? d0 - 65536 : d0;
        d1 = d1 >= 32768 ? d1 - 65536 : d1;

        using var reader = WfdbRecordReader.Open(Nstdb("118e24"));
        var got = new float[2];
        reader.Read([0, 1], frame, 1, got);
        Assert.Equal((d0 - 1024) / 200.0, got[0], 1e-4);
        Assert.Equal((d1 - 1024) / 200.0, got[1], 1e-4);
        Assert.NotEqual(d0 / 200.0, got[0], 1e-2);
    }

    [Fact]
    public void Record118e12_Format212_PhysicalUsesBaselineNotAdcZero()
    {
        // signal(5) format 212 worked by hand on frame 5 (bytes 15–17); header "212 200(1024) 11 0".
        var raw = RawBytes("118e12.dat", 15, 3);
        var d0 = raw[0] + 256 * (raw[1] % 16);
        var d1 = raw[2] + 256 * (raw[1] / 16);
        d0 = d0 >= 2048 ? d0 - 4096 : d0;
        d1 = d1 >= 2048 ? d1 - 4096 : d1;

        using var reader = WfdbRecordReader.Open(Nstdb("118e12"));
        var got = new float[2];
        reader.Read([0, 1], 5, 1, got);
        Assert.Equal((d0 - 1024) / 200.0, got[0], 1e-4);
        Assert.Equal((d1 - 1024) / 200.0, got[1], 1e-4);
    }

    [Fact]
    public void Record118e24_CleanFirstFiveMinutes_AreMitdb118ShiftedByBaseline()
    {
        // Source: nstdb README (noise is added from 5:00 on; 118e24 is mitdb 118 plus noise). The stored values of the
        // first 300 s are mitdb 118's minus 1024, so with the header's baseline of 1024 (header(5)) the physical values
        // read 1024 / 200 = 5.12 mV below mitdb 118's. Tolerance 1e-4 mV: float rounding.
        const int n = 300 * 360;
        using var clean = WfdbRecordReader.Open(Path.Combine(SharedData.Physionet("mitdb"), "118"));
        using var noisy = WfdbRecordReader.Open(Nstdb("118e24"));
        var a = new float[n];
        var b = new float[n];
        clean.Read(0, 0, a);
        noisy.Read(0, 0, b);
        for (var i = 0; i < n; i++)
        {
            Assert.Equal(a[i] - 5.12, b[i], 1e-4);
        }
    }

    [Fact]
    public void Atr_CountsMatchReadme()
    {
        // Source: nstdb README: each 118eXX .atr has 2,278 beats (R 2,166, A 96, V 16), 10 x, 12 ~ and one rhythm (N.
        foreach (var record in new[] { "118e00", "118e06", "118e12", "118e24", "118e_6" })
        {
            var atr = WfdbAnnotationReader.Read(Nstdb(record + ".atr"));
            Assert.Equal(2278, atr.Count(a => a.IsBeat));
            Assert.Equal(2166, atr.Count(a => a.Mnemonic == "R"));
            Assert.Equal(96, atr.Count(a => a.Mnemonic == "A"));
            Assert.Equal(16, atr.Count(a => a.Mnemonic == "V"));
            Assert.Equal(10, atr.Count(a => a.Mnemonic == "x"));
            Assert.Equal(12, atr.Count(a => a.Mnemonic == "~"));
            Assert.Equal(["(N"], atr.Select(a => a.RhythmText).OfType<string>());
        }
    }

    private static byte[] RawBytes(string file, long offset, int count)
    {
        var bytes = new byte[count];
        using var f = File.OpenRead(Nstdb(file));
        f.Position = offset;
        f.ReadExactly(bytes);
        return bytes;
    }
}
