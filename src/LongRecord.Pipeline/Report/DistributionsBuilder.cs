using LongRecord.Analysis.Beats;
using LongRecord.Reporting.Model;

namespace LongRecord.Pipeline.Report;

/// <summary>
/// Reduces the beat-to-beat intervals for the trend page: RR per time bin (lowest, mean, highest), an RR(n) against
/// RR(n+1) count grid and a heart-rate histogram. Intervals longer than the rhythm stage's beat-gap limit (no beats
/// there: missed detections or unreadable signal) are left out, as the rhythm stage leaves them out.
/// </summary>
public static class DistributionsBuilder
{
    private const double ScatterMinMs = 200, ScatterStepMs = 20;
    private const int ScatterBins = 90;
    private const double HistogramMinBpm = 20, HistogramStepBpm = 5;
    private const int HistogramBins = 46;

    // Bins of at least 10 s, and no more than about 4 400 of them (72 h at one a minute) so the plot stays light.
    private const int MaxTachogramBins = 4400;
    private const double MinTachogramBinS = 10;

    public static RhythmDistributions Build(IReadOnlyList<Beat> beats, double rateHz, double durationS, double maxGapS)
    {
        if (beats.Count < 2 || durationS <= 0)
        {
            return RhythmDistributions.Empty;
        }

        var binS = MinTachogramBinS * Math.Max(1, Math.Ceiling(durationS / MinTachogramBinS / MaxTachogramBins));
        var bins = (int)Math.Ceiling(durationS / binS);
        var min = new float[bins];
        var max = new float[bins];
        var sum = new double[bins];
        var n = new int[bins];
        Array.Fill(min, float.PositiveInfinity);
        Array.Fill(max, float.NegativeInfinity);
        var scatter = new int[ScatterBins * ScatterBins];
        var histogram = new int[HistogramBins];
        var previousMs = double.NaN;
        for (var i = 1; i < beats.Count; i++)
        {
            var rrS = (beats[i].Sample - beats[i - 1].Sample) / rateHz;
            if (rrS <= 0 || rrS > maxGapS)
            {
                previousMs = double.NaN;
                continue;
            }

            var ms = rrS * 1000;
            var b = Math.Min(bins - 1, (int)(beats[i].Sample / rateHz / binS));
            min[b] = Math.Min(min[b], (float)ms);
            max[b] = Math.Max(max[b], (float)ms);
            sum[b] += ms;
            n[b]++;
            var h = (int)((60 / rrS - HistogramMinBpm) / HistogramStepBpm);
            histogram[Math.Clamp(h, 0, HistogramBins - 1)]++;
            if (!double.IsNaN(previousMs))
            {
                var x = Math.Clamp((int)((previousMs - ScatterMinMs) / ScatterStepMs), 0, ScatterBins - 1);
                var y = Math.Clamp((int)((ms - ScatterMinMs) / ScatterStepMs), 0, ScatterBins - 1);
                scatter[x * ScatterBins + y]++;
            }

            previousMs = ms;
        }

        var mean = new float[bins];
        for (var b = 0; b < bins; b++)
        {
            mean[b] = n[b] == 0 ? float.NaN : (float)(sum[b] / n[b]);
            if (n[b] == 0)
            {
                min[b] = max[b] = float.NaN;
            }
        }

        return new RhythmDistributions
        {
            TachogramBinS = binS, RrMinMs = min, RrMeanMs = mean, RrMaxMs = max,
            ScatterMinMs = ScatterMinMs, ScatterStepMs = ScatterStepMs, ScatterBins = ScatterBins, ScatterCounts = scatter,
            HistogramMinBpm = HistogramMinBpm, HistogramStepBpm = HistogramStepBpm, HistogramCounts = histogram,
        };
    }
}
