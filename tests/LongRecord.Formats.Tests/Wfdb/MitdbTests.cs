using System.Text.RegularExpressions;
using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>MIT-BIH Arrhythmia Database (PhysioNet mitdb 1.0.0), read in place from the shared data folder.</summary>
public class MitdbTests
{
    private static string Mitdb(string file) => Path.Combine(SharedData.Physionet("mitdb"), file);

    [Fact]
    public void AllRecords_ReadFully_SamplesMatchHeaderChecksums()
    {
        // Source: mitdb README (48 records, 360 Hz, 2 signals, format 212, 650000 samples each); the checksum and
        // initial value of each signal are PhysioNet's own integrity fields in the .hea files.
        var records = WfdbReferenceChecks.RecordPaths("mitdb").ToList();
        Assert.Equal(48, records.Count);
        foreach (var path in records)
        {
            using var reader = WfdbRecordReader.Open(path);
            Assert.Equal("WFDB (format 212)", reader.Info.FormatDetail);
            Assert.All(reader.Info.Channels, c =>
            {
                Assert.Equal(360.0, c.SamplingRateHz);
                Assert.Equal(650000, c.SampleCount);
            });
            Assert.Equal(2 * 650000, WfdbReferenceChecks.AssertSamplesMatchHeaderChecksums(reader));
        }
    }

    [Fact]
    public void Record100_HeaderMatchesDatabaseDirectory()
    {
        // Source: mitdbdir/records.htm, record 100 "(MLII, V5; male, age 69)"; header(5) example 1 (gain 200,
        // 11-bit ADC, ADC zero 1024, baseline equal to the ADC zero, first samples 995 and 1011).
        using var reader = WfdbRecordReader.Open(Mitdb("100.hea"));
        var info = reader.Info;
        Assert.Equal(["MLII", "V5"], info.Channels.Select(c => c.Label));
        Assert.Equal(1805.5555555555557, info.DurationS, 9);
        Assert.All(info.Channels, c =>
        {
            Assert.Equal(200.0, c.Gain);
            Assert.Equal(1024.0, c.Baseline);
            Assert.Equal("", c.PhysicalUnit);
            Assert.Equal(1.0, c.MillivoltsPerUnit);
            Assert.Equal(0, c.DigitalMin);
            Assert.Equal(2047, c.DigitalMax);
        });
        Assert.Equal([995, 1011], reader.Header.Signals.Select(s => s.InitialValue!.Value));
        Assert.Equal(["69 M 1085 1629 x1", "Aldomet, Inderal"], info.Comments);
        Assert.Null(info.StartDate);
        Assert.Null(info.StartTime);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(12345)]
    [InlineData(649999)]
    public void Record100_SamplesEqualHandDecodedFormat212Bytes(long frame)
    {
        // signal(5) format 212, worked by hand: byte 0 and the low nibble of byte 1 hold sample 0, byte 2 and the high
        // nibble of byte 1 hold sample 1, both 12-bit two's complement. Physical = (digital − 1024) / 200 mV
        // (header(5) example 1). Tolerance 1e-5 mV: float rounding of values below 16 mV.
        var bytes = new byte[3];
        using (var f = File.OpenRead(Mitdb("100.dat")))
        {
            f.Position = frame * 3;
            f.ReadExactly(bytes);
        }

        var lead0 = bytes[0] + 256 * (bytes[1] % 16);
        var lead1 = bytes[2] + 256 * (bytes[1] / 16);
        lead0 = lead0 >= 2048 ? lead0 - 4096 : lead0;
        lead1 = lead1 >= 2048 ? lead1 - 4096 : lead1;

        using var reader = WfdbRecordReader.Open(Mitdb("100"));
        var got = new float[2];
        reader.Read([0, 1], frame, 1, got);
        Assert.Equal((lead0 - 1024) / 200.0, got[0], 1e-5);
        Assert.Equal((lead1 - 1024) / 200.0, got[1], 1e-5);
    }

    [Fact]
    public void Record100_BeatCountsMatchDatabaseDirectory()
    {
        // Source: mitdbdir/records.htm, record 100: Normal 2239, APC 33, PVC 1, total 2273 beats.
        var annotations = WfdbAnnotationReader.Read(Mitdb("100.atr"));
        Assert.Equal(2273, annotations.Count(a => a.IsBeat));
        Assert.Equal(2239, annotations.Count(a => a.Code == WfdbAnnotationCode.Normal));
        Assert.Equal(33, annotations.Count(a => a.Code == WfdbAnnotationCode.AtrialPremature));
        Assert.Equal(1, annotations.Count(a => a.Code == WfdbAnnotationCode.PrematureVentricular));
    }

    [Fact]
    public void AllRecords_BeatTypeCountsMatchDatabaseDirectory()
    {
        // Source: mitdbdir/records.htm, each record's beat table. Its row names map to annotation mnemonics as the
        // directory's own key does. Each type is checked against "Before 5:00" + "After 5:00": the "Total" column has
        // one typo (record 108, Normal: 279 + 1460 printed as 1740). The "Total" row counts the beat labels plus
        // blocked APCs (x) and ventricular flutter waves (!).
        var rows = new Dictionary<string, string>
        {
            ["Normal"] = "N", ["Left BBB"] = "L", ["Right BBB"] = "R", ["APC"] = "A", ["Aberrated APC"] = "a",
            ["Junctional premature"] = "J", ["SVPC"] = "S", ["PVC"] = "V", ["Fusion PVC"] = "F", ["Atrial escape"] = "e",
            ["Junctional escape"] = "j", ["Ventricular escape"] = "E", ["Paced"] = "/", ["Pacemaker fusion"] = "f",
            ["Unclassifiable"] = "Q", ["Blocked APC"] = "x", ["Ventricular flutter wave"] = "!",
        };
        var html = File.ReadAllText(Mitdb(Path.Combine("mitdbdir", "records.htm")));
        var sections = Regex.Matches(html, "<a name=\"(\\d{3})\">Record \\d{3}(.*?)</table>", RegexOptions.Singleline);
        Assert.Equal(48, sections.Count);
        foreach (Match section in sections)
        {
            var record = section.Groups[1].Value;
            var byMnemonic = WfdbAnnotationReader.Read(Mitdb(record + ".atr")).GroupBy(a => a.Mnemonic).ToDictionary(g => g.Key, g => g.Count());
            var total = -1;
            foreach (Match row in Regex.Matches(section.Groups[2].Value, "<td>([^<]+)</td><td>([-\\d]+)</td><td>([-\\d]+)</td><td>(\\d+)</td>"))
            {
                var name = row.Groups[1].Value;
                var expected = Count(row.Groups[2].Value) + Count(row.Groups[3].Value);
                if (name == "Total")
                {
                    total = expected;
                    Assert.Equal(total, Count(row.Groups[4].Value));
                    continue;
                }

                Assert.True(rows.ContainsKey(name), $"record {record}: unmapped directory row '{name}'");
                Assert.Equal((record, name, expected), (record, name, byMnemonic.GetValueOrDefault(rows[name])));
            }

            var beats = byMnemonic.Where(p => WfdbAnnotationCodes.IsBeat(WfdbAnnotationCodes.FromMnemonic(p.Key)!.Value)).Sum(p => p.Value);
            Assert.Equal((record, total), (record, beats + byMnemonic.GetValueOrDefault("x") + byMnemonic.GetValueOrDefault("!")));
        }

        static int Count(string cell) => cell == "-" ? 0 : int.Parse(cell, System.Globalization.CultureInfo.InvariantCulture);
    }

    [Fact]
    public void AllRecords_BeatTotalMatchesPublishedCount()
    {
        // Source: mitdb README ("109,494 beat annotations in total (matches the published count)").
        var beats = WfdbReferenceChecks.RecordPaths("mitdb").Sum(p => WfdbAnnotationReader.Enumerate(p + ".atr").Count(a => a.IsBeat));
        Assert.Equal(109494, beats);
    }

    [Fact]
    public void AtrialFibrillationRhythm_InRecordsTheDirectoryLists()
    {
        // Source: mitdbdir/records.htm: records whose rhythm table lists "Atrial fibrillation" (201, 202, 203, 210,
        // 217, 219, 221, 222). The brief's list from memory left out 217; the directory and 217.atr both have it.
        var html = File.ReadAllText(Mitdb(Path.Combine("mitdbdir", "records.htm")));
        var expected = Regex.Matches(html, "<a name=\"(\\d{3})\">Record \\d{3}(.*?)(?=<a name=\"\\d{3}\">|$)", RegexOptions.Singleline)
            .Where(m => m.Groups[2].Value.Contains("<td>Atrial fibrillation</td>", StringComparison.Ordinal))
            .Select(m => m.Groups[1].Value)
            .ToArray();
        Assert.Equal(["201", "202", "203", "210", "217", "219", "221", "222"], expected);

        var withAfib = SharedData.Records("mitdb")
            .Where(r => WfdbAnnotationReader.Read(Mitdb(r + ".atr")).Any(a => a.RhythmText == "(AFIB"))
            .ToArray();
        Assert.Equal(expected, withAfib);
    }
}
