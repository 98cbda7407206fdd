using LongRecord.Formats.Edf;
using LongRecord.TestSupport;
using static LongRecord.Formats.Tests.Edf.EdfHandAssembly;

namespace LongRecord.Formats.Tests.Edf;

/// <summary>
/// EDF+D read against a hand-assembled file (EDF+ spec, Kemp and Olivan 2003, 2.2.4 "time keeping of data records": each
/// record's first TAL "+onset 0x14 0x14" gives its start relative to the header start time).
/// </summary>
public sealed class EdfDiscontinuousTests : IDisposable
{
    // Six 1-s records whose time-keeping onsets are 0.5, 1.5, 2.5, 5.5, 6.5, 10.5 s after the header time 23.59.59:
    // a sub-second start of 0.5 s and two gaps, [3, 5) and [7, 10) s of elapsed time.
    private static readonly double[] s_onsets = [0.5, 1.5, 2.5, 5.5, 6.5, 10.5];

    private readonly TempFolder _folder = new("edfd");
    private readonly string _path;

    public EdfDiscontinuousTests()
    {
        var signals = new[]
        {
            new SignalSpec("A", 10, Unit: "degC"), new SignalSpec("B", 5, Unit: "degC"), new SignalSpec("C", 10, Unit: "degC"), new SignalSpec("EDF Annotations", 30),
        };
        var records = new List<DataRecord>();
        for (var r = 0; r < s_onsets.Length; r++)
        {
            var tals = $"+{s_onsets[r].ToString(System.Globalization.CultureInfo.InvariantCulture)}\u0014\u0014\0";
            if (r == 1)
            {
                tals += "+1.75\u00150.5\u0014Arousal\u0014\0";
            }

            if (r == 3)
            {
                tals += "+6\u0014Patient button\u0014Diary: walking\u0014\0";
            }

            records.Add(new DataRecord([Ramp(r * 100, 10), Ramp(r * 100 + 50, 5), Ramp(-r * 100, 10)], tals));
        }

        _path = _folder.Write("discontinuous.edf", Build("EDF+D", "31.12.23", "23.59.59", "1", signals, records));
    }

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void HandAssembledEdfPlusD_ReportsTwoGapsAndDuration()
    {
        using var reader = EdfReader.Open(_path);
        var info = reader.Info;
        Assert.Equal("EDF+D", info.FormatDetail);
        Assert.Equal([new RecordingGap(3, 2), new RecordingGap(7, 3)], info.Gaps);
        // Elapsed axis: last record starts at 10 s and lasts 1 s.
        Assert.Equal(11, info.DurationS, 9);
        Assert.Equal([110L, 55L, 110L], info.Channels.Select(c => c.SampleCount));
        Assert.Equal([10.0, 5.0, 10.0], info.Channels.Select(c => c.SamplingRateHz));
    }

    [Fact]
    public void HandAssembledEdfPlusD_SubSecondStartMovesStartTimeAndEvents()
    {
        using var reader = EdfReader.Open(_path);
        var info = reader.Info;
        // Header 31.12.23 23.59.59 plus the first record's "+0.5" (EDF+ 2.2.4): the first sample is at 23:59:59.5.
        Assert.Equal(new DateTime(2023, 12, 31, 23, 59, 59, 500), info.StartDateTime);
        // TAL onsets count from the header time; elapsed onsets from the first sample, 0.5 s later.
        Assert.Equal(
            [new RecordingEvent(1.25, 0.5, "Arousal"), new RecordingEvent(5.5, null, "Patient button"), new RecordingEvent(5.5, null, "Diary: walking")],
            info.Events);
    }

    [Fact]
    public void HandAssembledEdfPlusD_SamplesSitOnTheElapsedAxisWithNaNInGaps()
    {
        using var reader = EdfReader.Open(_path);
        var a = new float[30];
        reader.Read(0, 25, a);
        // Positions 25–29: record 3 (elapsed 2 s, 10 Hz), samples 5–9 of Ramp(200); 30–49: gap; 50–54: record 4 (elapsed 5 s).
        Assert.Equal([205f, 206, 207, 208, 209], a[..5]);
        Assert.All(a[5..25], v => Assert.True(float.IsNaN(v)));
        Assert.Equal([300f, 301, 302, 303, 304], a[25..]);

        var b = new float[55];
        reader.Read(1, 0, b);
        // 5 Hz: record 4 (elapsed 5 s) starts at position 25 with Ramp(350), record 6 (elapsed 10 s) at 50 with Ramp(550).
        Assert.Equal(254f, b[14]); // last sample of record 3 (elapsed 2 s), Ramp(250)
        Assert.Equal(350f, b[25]);
        Assert.Equal(550f, b[50]);
        Assert.All(b[15..25].Concat(b[35..50]), v => Assert.True(float.IsNaN(v)));
    }

    [Fact]
    public void HandAssembledEdfPlusD_MultiChannelReadMatchesSingleChannelReads()
    {
        using var reader = EdfReader.Open(_path);
        var both = new float[2 * 110];
        reader.Read([0, 2], 0, 110, both);
        var a = new float[110];
        var c = new float[110];
        reader.Read(0, 0, a);
        reader.Read(2, 0, c);
        Assert.Equal(Bits(a), Bits(both[..110]));
        Assert.Equal(Bits(c), Bits(both[110..]));
        Assert.Equal(-500f, c[100]);
    }

    private static short[] Ramp(int first, int count) => Enumerable.Range(first, count).Select(v => (short)v).ToArray();

    private static int[] Bits(float[] x) => x.Select(BitConverter.SingleToInt32Bits).ToArray();
}
