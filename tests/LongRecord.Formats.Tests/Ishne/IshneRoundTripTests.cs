using LongRecord.Formats.Ishne;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Ishne;

public class IshneRoundTripTests
{
    // The writer rounds to the nearest step, so a value comes back within half a step; the bound here is one step
    // (the resolution in mV, plus float rounding of values near ±2 mV, about 2.4e-7).
    [Fact]
    public void WriteThenRead_SamplesWithinOneQuantisationStep()
    {
        using var temp = new TempFolder("ishne");
        var path = temp.Path("round.ecg");
        const int n = 5000;
        var signal = IshneTestSignals.Millivolts(2, n);
        var options = IshneTestSignals.TwoLeadOptions();
        using (var writer = IshneWriter.Create(path, options))
        {
            // Two uneven blocks, to exercise appending.
            var first = 1234;
            writer.Write(ChannelMajorSlice(signal, 2, n, 0, first), first);
            writer.Write(ChannelMajorSlice(signal, 2, n, first, n - first), n - first);
            writer.Complete();
        }

        using var reader = IshneReader.Open(path);
        Assert.Equal(n, reader.Info.Channels[0].SampleCount);
        var back = new float[2 * n];
        reader.Read([0, 1], 0, n, back);
        for (var k = 0; k < 2; k++)
        {
            var step = options.Leads[k].ResolutionNv * 1e-6;
            Assert.Equal(step, reader.Info.Channels[k].Resolution, 12);
            for (var i = 0; i < n; i++)
            {
                Assert.True(Math.Abs(back[k * n + i] - signal[k * n + i]) <= step, $"lead {k} sample {i}: {back[k * n + i]} vs {signal[k * n + i]}");
            }
        }

        Assert.Equal(new DateOnly(2026, 3, 4), reader.Info.StartDate);
        Assert.Equal(new TimeOnly(8, 15, 30), reader.Info.StartTime);
        Assert.Equal("Tobiah Quillfeather", reader.Info.Identification.PatientName);
        Assert.Equal("NW-2026-0031", reader.Info.Identification.PatientId);
        Assert.Equal("M", reader.Info.Identification.Sex);
        Assert.Equal("1958-11-02", reader.Info.Identification.BirthDate);
        Assert.Equal(["arrived 08:05", "exercise 10:20-10:50"], reader.Info.Comments);
    }

    [Fact]
    public void WriteThenRead_NaNIsLeadFault_AndOutOfRangeClips()
    {
        using var temp = new TempFolder("ishne");
        var path = temp.Path("fault.ecg");
        var options = IshneTestSignals.TwoLeadOptions();
        using (var writer = IshneWriter.Create(path, options))
        {
            // Lead 1 (2 500 nV): NaN, +1000 mV (beyond 32 767 × 2.5 µV = 81.9 mV); lead 2: 0.5 mV, −1000 mV.
            writer.Write([float.NaN, 1000f, 0.5f, -1000f], 2);
            writer.Complete();
        }

        using var reader = IshneReader.Open(path);
        var values = new float[4];
        reader.Read([0, 1], 0, 2, values);
        Assert.True(float.IsNaN(values[0]));
        Assert.Equal(32767 * 2500e-6, values[1], 4);
        Assert.Equal(0.5, values[2], 6);
        Assert.Equal(-32767 * 5000e-6, values[3], 4);
    }

    private static float[] ChannelMajorSlice(float[] all, int leads, int n, int start, int count)
    {
        var slice = new float[leads * count];
        for (var k = 0; k < leads; k++)
        {
            Array.Copy(all, k * n + start, slice, k * count, count);
        }

        return slice;
    }
}
