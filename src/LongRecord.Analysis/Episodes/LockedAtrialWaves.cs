using LongRecord.Analysis.Beats;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// Atrial waves locked to the QRS in a regular tachycardia: in 2:1 flutter every second flutter wave sits in the same
/// place of every beat, so an average-beat subtraction would remove it, and at 150 bpm the gaps between the QRS–T
/// complexes are too short for a spectrum. Instead the episode's mean cycle (R-centred, beats at the median RR ± 5 %)
/// is freed of its T wave by spatial projection: the lead direction of the T wave of the conducted beats before the
/// episode (their ST–T region's principal direction) is projected out of every sample, which leaves atrial waves that
/// point elsewhere (the idea of spatial QRS–T cancellation; our own construction). The remainder is correlated with
/// itself 1/n of a cycle later, the QRS left out: flutter waves repeating n times per cycle give a correlation near 1,
/// one P wave per cycle does not. With one lead nothing can be projected and the mean cycle is used as it is (weaker).
/// </summary>
internal static class LockedAtrialWaves
{
    private const double MaskBeforeS = 0.05, MaskAfterS = 0.07;

    /// <summary>The index for n waves per cycle; NaN with too few regular beats.</summary>
    public static double Index(SignalWindow w, BeatTrack t, int first, int last, double medianRrS, int n, double fastRrS)
    {
        var fs = w.RateHz;
        var leads = w.Leads;
        var length = (int)Math.Round(medianRrS * fs);
        var halfL = length / 2;
        var cycle = MeanCycle(w, t, first, last, medianRrS, length, out var count);
        if (count < 6)
        {
            return double.NaN;
        }

        if (leads >= 2)
        {
            var d = TDirection(w, t, first, fastRrS) ?? OwnTDirection(cycle, leads, length, halfL + (int)Math.Round(0.08 * fs), halfL + halfL);
            for (var j = 0; j < length; j++)
            {
                double dot = 0;
                for (var a = 0; a < leads; a++)
                {
                    dot += cycle[a * length + j] * d[a];
                }

                for (var a = 0; a < leads; a++)
                {
                    cycle[a * length + j] -= dot * d[a];
                }
            }
        }

        var mask0 = halfL - (int)Math.Round(MaskBeforeS * fs);
        var mask1 = halfL + (int)Math.Round(MaskAfterS * fs);
        var shift = (int)Math.Round((double)length / n);
        double ab = 0, aa = 0, bb = 0;
        for (var lead = 0; lead < leads; lead++)
        {
            var span = cycle.AsSpan(lead * length, length);
            double mean = 0;
            var kept = 0;
            for (var j = 0; j < length; j++)
            {
                if (j < mask0 || j > mask1)
                {
                    mean += span[j];
                    kept++;
                }
            }

            mean /= Math.Max(1, kept);
            for (var j = 0; j < length; j++)
            {
                var k = (j + shift) % length;
                if ((j >= mask0 && j <= mask1) || (k >= mask0 && k <= mask1))
                {
                    continue;
                }

                ab += (span[j] - mean) * (span[k] - mean);
                aa += (span[j] - mean) * (span[j] - mean);
                bb += (span[k] - mean) * (span[k] - mean);
            }
        }

        return aa > 0 && bb > 0 ? ab / Math.Sqrt(aa * bb) : double.NaN;
    }

    private static double[] MeanCycle(SignalWindow w, BeatTrack t, int first, int last, double medianRrS, int length, out int count)
    {
        var halfL = length / 2;
        var cycle = new double[w.Leads * length];
        count = 0;
        for (var i = first + 1; i < last; i++)
        {
            if (!t.HasRr(i) || !t.HasRr(i + 1) || Math.Abs(t.RrS[i] - medianRrS) > 0.05 * medianRrS
                || Math.Abs(t.RrS[i + 1] - medianRrS) > 0.05 * medianRrS || !w.Holds(t[i].Sample - halfL, t[i].Sample - halfL + length - 1))
            {
                continue;
            }

            var c = w.At(t[i].Sample) - halfL;
            for (var lead = 0; lead < w.Leads; lead++)
            {
                var x = w.Lead(lead);
                for (var j = 0; j < length; j++)
                {
                    cycle[lead * length + j] += float.IsNaN(x[c + j]) ? 0 : x[c + j];
                }
            }

            count++;
        }

        for (var j = 0; j < cycle.Length && count > 0; j++)
        {
            cycle[j] /= count;
        }

        return cycle;
    }

    // The T wave's lead direction from the normal, not fast beats before the episode: the principal direction of their
    // mean complex from 120 ms after R to 60 % of their RR, each lead's PR-segment level removed. Null with fewer than five.
    private static double[]? TDirection(SignalWindow w, BeatTrack t, int first, double fastRrS)
    {
        var fs = w.RateHz;
        var beats = new List<int>();
        for (var i = first - 1; i > 0 && t[i].Sample >= w.StartSample && beats.Count < 20; i--)
        {
            if (t[i].Class == BeatClass.N && t.HasRr(i) && t.RrS[i] >= fastRrS && t.HasRr(i + 1) && t.RrS[i + 1] >= fastRrS)
            {
                beats.Add(i);
            }
        }

        if (beats.Count < 5)
        {
            return null;
        }

        var rr = beats.Select(i => (double)t.RrS[i]).Order().ToList();
        var before = (int)Math.Round(0.08 * fs);
        var from = (int)Math.Round(0.12 * fs);
        var to = (int)Math.Round(0.6 * rr[rr.Count / 2] * fs);
        var leads = w.Leads;
        var mean = new double[leads * (to - from + 1)];
        var level = new double[leads];
        var used = 0;
        foreach (var i in beats)
        {
            if (!w.Holds(t[i].Sample - before, t[i].Sample + to))
            {
                continue;
            }

            var c = w.At(t[i].Sample);
            for (var a = 0; a < leads; a++)
            {
                var x = w.Lead(a);
                level[a] += float.IsNaN(x[c - before]) ? 0 : x[c - before];
                for (var j = from; j <= to; j++)
                {
                    mean[a * (to - from + 1) + j - from] += float.IsNaN(x[c + j]) ? 0 : x[c + j];
                }
            }

            used++;
        }

        if (used < 5)
        {
            return null;
        }

        var span = to - from + 1;
        for (var a = 0; a < leads; a++)
        {
            for (var j = 0; j < span; j++)
            {
                mean[a * span + j] = (mean[a * span + j] - level[a]) / used;
            }
        }

        return Principal(mean, leads, span, 0, span);
    }

    private static double[] OwnTDirection(double[] cycle, int leads, int length, int from, int to) =>
        Principal(cycle, leads, length, Math.Clamp(from, 0, length), Math.Clamp(to, 0, length));

    // Principal lead direction of samples from … to − 1 (power iteration on the leads' covariance about zero).
    private static double[] Principal(double[] x, int leads, int length, int from, int to)
    {
        var cov = new double[leads, leads];
        for (var j = from; j < to; j++)
        {
            for (var a = 0; a < leads; a++)
            {
                for (var b = 0; b < leads; b++)
                {
                    cov[a, b] += x[a * length + j] * x[b * length + j];
                }
            }
        }

        var v = new double[leads];
        for (var a = 0; a < leads; a++)
        {
            v[a] = 1.0 / Math.Sqrt(leads) + 0.01 * a;
        }

        for (var it = 0; it < 60; it++)
        {
            var next = new double[leads];
            for (var a = 0; a < leads; a++)
            {
                for (var b = 0; b < leads; b++)
                {
                    next[a] += cov[a, b] * v[b];
                }
            }

            var norm = Math.Sqrt(next.Sum(q => q * q));
            if (norm <= 0)
            {
                break;
            }

            for (var a = 0; a < leads; a++)
            {
                v[a] = next[a] / norm;
            }
        }

        return v;
    }
}
