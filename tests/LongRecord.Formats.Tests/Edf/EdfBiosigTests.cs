using LongRecord.Formats.Edf;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Edf;

/// <summary>
/// Files our writer produces must read the same in an independent reader: BioSig's save2gdf (biosig-tools 2.5, Debian),
/// which decodes EDF/BDF to per-channel text. Channels, rates, sample counts and every sample value are compared.
/// </summary>
public sealed class EdfBiosigTests : IDisposable
{
    private readonly TempFolder _folder = new("edf-biosig");

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void ThreeLeadEdfPlusC_ReadsTheSameInSave2Gdf()
    {
        var path = _folder.Path("three.edf");
        EdfTestSignals.Write(path, EdfTestSignals.ThreeLeads(), EdfRoundTripTests.ThreeLeadSignals(), 777, w =>
        {
            foreach (var e in EdfRoundTripTests.s_events)
            {
                w.AddAnnotation(e.OnsetS, e.DurationS, e.Text);
            }
        });

        var output = Compare(path);
        // save2gdf lists the EDF+ annotations it found, with the onset converted to a whole sample (GDF keeps event
        // positions in samples), so onsets agree to within one sample period at 250 Hz.
        Assert.Equal(EdfRoundTripTests.s_events.Select(e => e.Text), output.Events.Select(e => e.Text));
        Assert.All(EdfRoundTripTests.s_events.Zip(output.Events), p => Assert.InRange(p.First.OnsetS - p.Second.OnsetS, 0, 1.0 / 250));
    }

    [Fact]
    public void ChannelsOfDifferentRates_ReadTheSameInSave2Gdf()
    {
        var path = _folder.Path("multirate.edf");
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
            writer.Append(0, EdfTestSignals.Make(5000, 500, 1.0, seed: 6));
            writer.Append(1, EdfTestSignals.Make(250, 25, 100, seed: 7));
            writer.Complete();
        }

        Compare(path);
    }

    [Fact]
    public void BdfPlusC_ReadsTheSameInSave2Gdf()
    {
        var path = _folder.Path("three.bdf");
        var options = EdfTestSignals.ThreeLeads(bdf: true);
        EdfTestSignals.Write(path, options, EdfRoundTripTests.ThreeLeadSignals(), 1000);
        Compare(path);
    }

    private Save2Gdf.Output Compare(string path)
    {
        var output = Save2Gdf.Convert(path, _folder.Path(Path.GetFileNameWithoutExtension(path) + "-" + Path.GetExtension(path).TrimStart('.')));
        using var reader = EdfReader.Open(path);
        var ours = reader.Info.Channels;
        Assert.Equal(ours.Count, output.Channels.Count);
        for (var c = 0; c < ours.Count; c++)
        {
            var theirs = output.Channels[c];
            var channel = ours[c];
            Assert.Equal(channel.Label, theirs.Label);
            Assert.Equal(channel.PhysicalUnit, theirs.Unit);
            Assert.Equal(channel.SamplingRateHz, theirs.SamplingRateHz);
            Assert.Equal(channel.SampleCount, theirs.SampleCount);
            Assert.Equal(channel.DigitalMin, theirs.DigMin);
            Assert.Equal(channel.DigitalMax, theirs.DigMax);
            Assert.Equal(channel.SampleCount, theirs.Values.Length);

            var values = new float[channel.SampleCount];
            reader.Read(c, 0, values);
            // save2gdf prints the file's physical unit; we return mV for voltages.
            var toOurs = channel.IsVoltage ? channel.MillivoltsPerUnit : 1.0;
            for (var i = 0; i < values.Length; i++)
            {
                var expected = Save2Gdf.Number(theirs.Values[i]) * toOurs;
                // Half its last printed digit (6 significant digits) plus our float result's rounding (≤ 2 ulp, 2.4e-7 relative).
                var tolerance = Save2Gdf.HalfSixthDigit(expected) + 2.4e-7 * Math.Abs(expected);
                Assert.True(Math.Abs(values[i] - expected) <= tolerance,
                    $"{Path.GetFileName(path)} channel {c} sample {i}: ours {values[i]}, save2gdf {theirs.Values[i]} (tolerance {tolerance})");
            }
        }

        return output;
    }
}
