using LongRecord.Analysis.Beats;
using LongRecord.Pipeline.Report;

namespace LongRecord.Reporting.Tests.Mapping;

/// <summary>The trend page's reductions of the RR series, against a hand-worked example.</summary>
public sealed class DistributionsBuilderTests
{
    [Fact]
    public void FourIntervalsAndAGap_HandWorkedBinsCellsAndCounts()
    {
        // 250 Hz. Beats at 0, 1.0, 2.0, 3.5 s, then 15.5 s (a 12 s gap, longer than the 10 s beat-gap limit) and 16.25 s.
        // Intervals: 1000, 1000, 1500 ms, (gap, left out), 750 ms.
        long[] samples = [0, 250, 500, 875, 3875, 4062];
        var beats = samples.Select(s => new Beat { Sample = s, Class = BeatClass.N }).ToArray();
        var d = DistributionsBuilder.Build(beats, 250, 20, 10);

        // 20 s at the 10 s minimum bin: two bins; beats are binned by the time of the interval's second beat.
        Assert.Equal(10, d.TachogramBinS);
        Assert.Equal(2, d.RrMeanMs.Length);
        Assert.Equal(1000f, d.RrMinMs[0]);
        Assert.Equal(1500f, d.RrMaxMs[0]);
        Assert.Equal((1000 + 1000 + 1500) / 3f, d.RrMeanMs[0], 3);
        Assert.Equal(748f, d.RrMeanMs[1]); // (4062 − 3875) / 250 s = 0.748 s

        // Heart rate 60 / RR: 60, 60, 40, 80.2 bpm in 5 bpm bins from 20 bpm: bins 8, 8, 4, 12.
        Assert.Equal(2, d.HistogramCounts[8]);
        Assert.Equal(1, d.HistogramCounts[4]);
        Assert.Equal(1, d.HistogramCounts[12]);
        Assert.Equal(4, d.HistogramCounts.Sum());

        // Pairs of consecutive intervals, 20 ms cells from 200 ms: (1000, 1000) → (40, 40); (1000, 1500) → (40, 65).
        // The gap breaks the pairs, so 750 ms after it pairs with nothing.
        Assert.Equal(1, d.ScatterCounts[40 * d.ScatterBins + 40]);
        Assert.Equal(1, d.ScatterCounts[40 * d.ScatterBins + 65]);
        Assert.Equal(2, d.ScatterCounts.Sum());
    }
}
