using LongRecord.Synthesis.Truth;

namespace LongRecord.Synthesis.Tests;

/// <summary>
/// Simple, independent measurements made on rendered samples, so that the tests judge the signal and not the script.
/// </summary>
internal static class SignalProbe
{
    /// <summary>Renders samples [start, start + count) of every lead into one array per lead.</summary>
    public static float[][] Render(SyntheticRecording rec, long start, int count, SignalComponents components = SignalComponents.All)
    {
        var buffer = new float[rec.Leads.Count * count];
        rec.Render(start, count, buffer, components);
        return Enumerable.Range(0, rec.Leads.Count).Select(k => buffer.AsSpan(k * count, count).ToArray()).ToArray();
    }

    /// <summary>
    /// R peaks found on the signal (common practice, no source): a slope signal (sum over leads of the absolute central
    /// difference, smoothed over 40 ms) above a quarter of its largest value in the surrounding ±3 s marks QRS regions;
    /// regions closer than 60 ms merge (up to 200 ms in all), and of two regions starting within 250 ms (refractory period) the one with the
    /// steeper slope is kept; the peak is the sample of largest |x − moving average over 0.6 s| in lead 0
    /// within the region ± 40 ms. Returns sample indices relative to <paramref name="leads"/>' first sample.
    /// </summary>
    public static List<long> FindRPeaks(float[][] leads, double fs)
    {
        var n = leads[0].Length;
        var slope = new double[n];
        foreach (var x in leads)
        {
            for (var i = 1; i < n - 1; i++)
            {
                slope[i] += Math.Abs(x[i + 1] - x[i - 1]);
            }
        }

        var smooth = MovingAverage(slope, (int)(0.04 * fs) | 1);
        var centred = Subtract(leads[0], MovingAverage(leads[0].Select(v => (double)v).ToArray(), (int)(0.6 * fs) | 1));

        var blockLength = (int)fs;
        var blocks = (n + blockLength - 1) / blockLength;
        var blockMax = new double[blocks];
        for (var i = 0; i < n; i++)
        {
            blockMax[i / blockLength] = Math.Max(blockMax[i / blockLength], smooth[i]);
        }

        var regions = new List<(int From, int To, double Peak)>();
        for (var i = 0; i < n; i++)
        {
            var b = i / blockLength;
            var local = 0.0;
            for (var j = Math.Max(0, b - 3); j <= Math.Min(blocks - 1, b + 3); j++)
            {
                local = Math.Max(local, blockMax[j]);
            }

            if (smooth[i] <= 0.25 * local)
            {
                continue;
            }

            if (regions.Count > 0 && i - regions[^1].To <= 0.06 * fs && i - regions[^1].From <= 0.2 * fs)
            {
                regions[^1] = (regions[^1].From, i, Math.Max(regions[^1].Peak, smooth[i]));
            }
            else if (regions.Count == 0 || i - regions[^1].From >= 0.25 * fs)
            {
                regions.Add((i, i, smooth[i]));
            }
            else if (smooth[i] > regions[^1].Peak)
            {
                // Within the refractory period of a weaker region (a T or P wave): the stronger one is the QRS.
                regions[^1] = (i, i, smooth[i]);
            }
        }

        var peaks = new List<long>();
        var reach = (int)(0.04 * fs);
        foreach (var (from, to, _) in regions)
        {
            var best = -1;
            for (var i = Math.Max(0, from - reach); i <= Math.Min(n - 1, to + reach); i++)
            {
                if (best < 0 || Math.Abs(centred[i]) > Math.Abs(centred[best]))
                {
                    best = i;
                }
            }

            peaks.Add(best);
        }

        return peaks;
    }

    /// <summary>Nearest value of a sorted list to <paramref name="x"/>, or null when the list is empty.</summary>
    public static long? Nearest(List<long> sorted, long x)
    {
        var i = sorted.BinarySearch(x);
        if (i >= 0)
        {
            return sorted[i];
        }

        i = ~i;
        long? best = null;
        foreach (var j in new[] { i - 1, i })
        {
            if (j >= 0 && j < sorted.Count && (best is null || Math.Abs(sorted[j] - x) < Math.Abs(best.Value - x)))
            {
                best = sorted[j];
            }
        }

        return best;
    }

    /// <summary>
    /// QRS width measured on a clean rendered beat (common practice, no source): in each lead whose QRS spans over
    /// 0.2 mV, the slope |x[n+1] − x[n−1]| is compared with its largest value within R ± 80 ms; onset (offset) is the
    /// earliest (latest) sample within R − 90 ms … R + 120 ms whose slope reaches 9.2 % of it — the slope ratio a single
    /// Gaussian edge has at its 2 % amplitude point (√(2 ln 50) widths out). Global onset is the earliest over leads,
    /// offset the latest. At tachycardia rates the next T wave's slope can reach into the offset window. Returns (onset, offset) in samples relative to the arrays.
    /// </summary>
    public static (int Onset, int Offset) MeasureQrs(float[][] leads, int rSample, double fs)
    {
        var onset = int.MaxValue;
        var offset = int.MinValue;
        var half = (int)(0.08 * fs);
        foreach (var x in leads)
        {
            double max = double.MinValue, min = double.MaxValue;
            for (var i = rSample - half; i <= rSample + half; i++)
            {
                max = Math.Max(max, x[i]);
                min = Math.Min(min, x[i]);
            }

            if (max - min < 0.2)
            {
                continue;
            }

            var peak = 0.0;
            int first = -1, last = -1;
            for (var i = rSample - half; i <= rSample + half; i++)
            {
                var s = Math.Abs(x[i + 1] - x[i - 1]);
                if (s > peak)
                {
                    peak = s;
                }
            }

            for (var i = rSample - half; i <= rSample + half; i++)
            {
                if (Math.Abs(x[i + 1] - x[i - 1]) >= 0.5 * peak)
                {
                    first = first < 0 ? i : first;
                    last = i;
                }
            }

            // Outermost supra-threshold samples within R − 90 ms … R + 120 ms, so that a notch between Q and R (or R
            // and S), where the slope passes through zero, does not end the QRS early.
            var threshold = 0.092 * peak;
            var a = first;
            for (var i = rSample - (int)(0.09 * fs); i < first; i++)
            {
                if (Math.Abs(x[i + 1] - x[i - 1]) >= threshold)
                {
                    a = i;
                    break;
                }
            }

            var b = last;
            for (var i = rSample + (int)(0.12 * fs); i > last; i--)
            {
                if (Math.Abs(x[i + 1] - x[i - 1]) >= threshold)
                {
                    b = i;
                    break;
                }
            }

            onset = Math.Min(onset, a);
            offset = Math.Max(offset, b);
        }

        return (onset, offset);
    }

    /// <summary>|Σ x e^(−2πi f t)|² over samples with their own times (a DFT over non-contiguous windows).</summary>
    public static double Power(IReadOnlyList<(double T, double X)> samples, double fHz)
    {
        double re = 0, im = 0;
        foreach (var (t, x) in samples)
        {
            var a = 2 * Math.PI * fHz * t;
            re += x * Math.Cos(a);
            im -= x * Math.Sin(a);
        }

        return re * re + im * im;
    }

    public static double Median(IEnumerable<double> values)
    {
        var v = values.OrderBy(x => x).ToArray();
        return v.Length % 2 == 1 ? v[v.Length / 2] : 0.5 * (v[v.Length / 2 - 1] + v[v.Length / 2]);
    }

    public static double CoefficientOfVariation(IReadOnlyList<double> values)
    {
        var mean = values.Average();
        var sd = Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (values.Count - 1));
        return sd / mean;
    }

    public static RhythmInterval Segment(SyntheticRecording rec, string kind) => rec.Truth.Rhythms.First(r => r.Kind == kind && !r.IsEpisode);

    private static double[] MovingAverage(double[] x, int width)
    {
        var prefix = new double[x.Length + 1];
        for (var i = 0; i < x.Length; i++)
        {
            prefix[i + 1] = prefix[i] + x[i];
        }

        var half = width / 2;
        var y = new double[x.Length];
        for (var i = 0; i < x.Length; i++)
        {
            var a = Math.Max(0, i - half);
            var b = Math.Min(x.Length, i + half + 1);
            y[i] = (prefix[b] - prefix[a]) / (b - a);
        }

        return y;
    }

    private static double[] Subtract(float[] x, double[] y) => x.Select((v, i) => v - y[i]).ToArray();
}
