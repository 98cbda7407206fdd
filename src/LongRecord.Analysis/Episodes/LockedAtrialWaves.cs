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

    // Least share of a stretch's power that must be signal for the noise correction to apply (our choice).
    private const double MinReliability = 0.3;

    /// <summary>The index for n waves per cycle; NaN with too few regular beats.</summary>
    public static double Index(SignalWindow w, BeatTrack t, int first, int last, double medianRrS, int n, double fastRrS)
    {
        var fs = w.RateHz;
        var leads = w.Leads;
        var length = (int)Math.Round(medianRrS * fs);
        var halfL = length / 2;
        var cycle = MeanCycle(w, t, first, last, medianRrS, length, out var count, out var noise);
        if (count < 6)
        {
            return double.NaN;
        }

        if (leads >= 2)
        {
            var d = TDirection(w, t, first, fastRrS) ?? OwnTDirection(cycle, leads, length, halfL + (int)Math.Round(0.08 * fs), halfL + halfL);
            for (var j = 0; j < length; j++)
            {
                double dot = 0, alongD = 0;
                for (var a = 0; a < leads; a++)
                {
                    dot += cycle[a * length + j] * d[a];
                    alongD += d[a] * d[a] * noise[a * length + j];
                }

                for (var a = 0; a < leads; a++)
                {
                    cycle[a * length + j] -= dot * d[a];
                    // The noise left in lead a once the direction is projected out (the leads' noise taken as
                    // independent): var(x_a − (Σ_b d_b x_b) d_a).
                    var v = noise[a * length + j];
                    noise[a * length + j] = v * (1 - 2 * d[a] * d[a]) + d[a] * d[a] * alongD;
                }
            }
        }

        var mask0 = halfL - (int)Math.Round(MaskBeforeS * fs);
        var mask1 = halfL + (int)Math.Round(MaskAfterS * fs);
        var shift = (int)Math.Round((double)length / n);
        double ab = 0, aa = 0, bb = 0, aaNoise = 0, bbNoise = 0;
        for (var lead = 0; lead < leads; lead++)
        {
            var span = cycle.AsSpan(lead * length, length);
            var spanNoise = noise.AsSpan(lead * length, length);
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
                aaNoise += spanNoise[j];
                bbNoise += spanNoise[k];
            }
        }

        if (!(aa > 0 && bb > 0))
        {
            return double.NaN;
        }

        // The noise left in the mean adds to each stretch's power but not to their product (the two stretches are
        // different samples), so it lowers the correlation by the square root of the two stretches' reliabilities
        // (signal power over total); Spearman's correction for attenuation (1904) divides it back out. A mean that is
        // mostly noise is left uncorrected: its correlation says little either way.
        double relA = 1 - aaNoise / aa, relB = 1 - bbNoise / bb;
        var r = ab / Math.Sqrt(aa * bb);
        return relA >= MinReliability && relB >= MinReliability ? Math.Min(1, r / Math.Sqrt(relA * relB)) : r;
    }

    // The mean cycle, and in `noise` the variance of each of its samples as an estimate (the beats' variance about the
    // mean over their number).
    private static double[] MeanCycle(SignalWindow w, BeatTrack t, int first, int last, double medianRrS, int length, out int count, out double[] noise)
    {
        var halfL = length / 2;
        var cycle = new double[w.Leads * length];
        var squares = new double[w.Leads * length];
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
                    double v = float.IsNaN(x[c + j]) ? 0 : x[c + j];
                    cycle[lead * length + j] += v;
                    squares[lead * length + j] += v * v;
                }
            }

            count++;
        }

        noise = new double[cycle.Length];
        for (var j = 0; j < cycle.Length && count > 0; j++)
        {
            cycle[j] /= count;
            noise[j] = count > 1 ? Math.Max(0, squares[j] / count - cycle[j] * cycle[j]) * count / (count - 1) / count : 0;
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
