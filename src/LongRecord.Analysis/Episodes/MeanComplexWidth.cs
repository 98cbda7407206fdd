namespace LongRecord.Analysis.Episodes;

/// <summary>
/// QRS width of an episode's mean complex: the beats are averaged R-aligned (noise falls as the square root of their
/// number), the leads' absolute slopes are summed, and the QRS runs from the first to the last sample within
/// −100 … +160 ms of R where that slope reaches 9 % of its peak, grown outward from the steepest point across dips under 24 ms — the slope level that marks where a Gaussian QRS
/// edge leaves the baseline (the synthesiser's truth definition, <c>fixtures/scenarios/README.md</c>). In noise the
/// threshold is at least twice the mean's roughness (the median over the window of its absolute second difference,
/// summed over the leads): muscle noise left after averaging is rough, while a mean of beats of differing shapes is
/// smooth. Without it the noise kept the slope sum above 9 % far outside the QRS, and narrow complexes in 12 dB
/// muscle noise measured 130–250 ms. (A floor from the beats' spread about the mean was tried first: in MITDB's
/// episodes of mixed morphologies it read the shapes' differences as noise and cut mean complexes to a few ms.)
/// </summary>
internal static class MeanComplexWidth
{
    private const double BeforeS = 0.1, AfterS = 0.16, SlopeFraction = 0.09, BridgeS = 0.024;

    // Multiple of the mean's roughness the threshold stays above (our choice: clean means, MITDB's included, stay
    // under the 9 % rule; in 12 dB muscle noise it sets the level).
    private const double RoughnessMultiple = 2;

    /// <summary>Width in ms of the mean complex of beats first … last (the first left out: it may be the trigger); NaN when fewer than 5 beats fit.</summary>
    public static double Measure(SignalWindow w, BeatTrack t, int first, int last)
    {
        var fs = w.RateHz;
        var before = (int)Math.Round(BeforeS * fs) + 2;
        var after = (int)Math.Round(AfterS * fs) + 2;
        var length = before + after + 1;
        var mean = new double[w.Leads * length];
        var count = 0;
        for (var i = first + 1; i <= last; i++)
        {
            var s = t[i].Sample;
            if (!w.Holds(s - before, s + after))
            {
                continue;
            }

            var c = w.At(s) - before;
            for (var lead = 0; lead < w.Leads; lead++)
            {
                var x = w.Lead(lead);
                for (var j = 0; j < length; j++)
                {
                    mean[lead * length + j] += float.IsNaN(x[c + j]) ? 0 : x[c + j];
                }
            }

            count++;
        }

        if (count < 5)
        {
            return double.NaN;
        }

        var slope = new double[length];
        for (var lead = 0; lead < w.Leads; lead++)
        {
            for (var j = 1; j < length - 1; j++)
            {
                slope[j] += Math.Abs(mean[lead * length + j + 1] - mean[lead * length + j - 1]) / count;
            }
        }

        var peakAt = 2;
        for (var j = 2; j < length - 2; j++)
        {
            peakAt = slope[j] > slope[peakAt] ? j : peakAt;
        }

        // A mean so rough that its noise floor reaches a third of the QRS's steepest slope cannot be delimited (6 dB
        // muscle noise over a dozen beats gave widths of 0–8 ms): no width rather than a wrong one.
        var floor = RoughnessMultiple * Roughness(mean, w.Leads, length, count);
        if (floor > slope[peakAt] / 3)
        {
            return double.NaN;
        }

        var threshold = Math.Max(SlopeFraction * slope[peakAt], floor);
        if (!(threshold > 0))
        {
            return double.NaN;
        }

        // Grow the QRS from its steepest sample across dips shorter than the bridge (the slope vanishes at each wave's
        // peak); the T wave, beyond the ST segment, is not reached.
        var bridge = (int)Math.Round(BridgeS * fs);
        int on = peakAt, off = peakAt;
        for (var j = peakAt; j >= 2 && peakAt - j <= before; j--)
        {
            if (slope[j] >= threshold)
            {
                on = j;
            }
            else if (on - j > bridge)
            {
                break;
            }
        }

        for (var j = peakAt; j < length - 2; j++)
        {
            if (slope[j] >= threshold)
            {
                off = j;
            }
            else if (j - off > bridge)
            {
                break;
            }
        }

        return 1000.0 * (off - on) / fs;
    }

    // The mean's roughness: per sample, the absolute second difference of the mean summed over the leads; the median
    // over the window, which the QRS occupies only a small part of.
    private static double Roughness(double[] sum, int leads, int length, int count)
    {
        var levels = new double[length - 2];
        for (var j = 1; j < length - 1; j++)
        {
            double level = 0;
            for (var lead = 0; lead < leads; lead++)
            {
                level += Math.Abs(sum[lead * length + j + 1] - 2 * sum[lead * length + j] + sum[lead * length + j - 1]) / count;
            }

            levels[j - 1] = level;
        }

        Array.Sort(levels);
        return levels[levels.Length / 2];
    }
}
