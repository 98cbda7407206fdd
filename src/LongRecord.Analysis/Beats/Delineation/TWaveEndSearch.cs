namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>
/// T-wave end. The T wave is searched, as in Laguna et al. (1994), in a window after the QRS end on the slow-wave lead:
/// its peak is the interior extremum furthest from the isoelectric level (the PR segment). Its end is located with the
/// trapezium-area rule of Vázquez-Seisdedos CR, Neto JE, Marañón Reyes EJ, Klautau A, Limão de Oliveira RC. "New
/// approach for T-wave end detection on electrocardiogram: performance in noisy conditions." Biomed Eng Online
/// 10:77 (2011): from the steepest point of the descending limb (x_m, y_m) to a reference point x_r beyond the T end,
/// the end is the x_i that maximises the area 0.5 (y_m − y_i)(2 x_r − x_i − x_m).
/// </summary>
internal static class TWaveEndSearch
{
    /// <summary>Returns the T end on one lead, or −1; <paramref name="amplitude"/> receives the T amplitude (mV, signed).</summary>
    public static int Find(ReadOnlySpan<float> w, ReadOnlySpan<float> d, int qrsOnset, int qrsOffset, int limit, in TWaveSamples p, out float amplitude)
    {
        amplitude = 0;
        var from = qrsOffset + p.StDelay;
        var to = Math.Min(limit, Math.Min(qrsOffset + p.MaxAfterQrs, qrsOnset + p.MaxQt));
        if (to - from < p.MinSearch || qrsOnset - p.Level < 0)
        {
            return -1;
        }

        // Isoelectric level: the mean over a short stretch just before the QRS onset.
        var level = 0f;
        for (var i = qrsOnset - p.Level; i < qrsOnset; i++)
        {
            level += w[i];
        }

        level /= p.Level;

        // The T peak: the interior local extremum furthest from the level.
        var peakAt = -1;
        var most = 0f;
        for (var i = from + 1; i < to; i++)
        {
            var v = w[i] - level;
            var isMax = w[i] >= w[i - 1] && w[i] > w[i + 1];
            var isMin = w[i] <= w[i - 1] && w[i] < w[i + 1];
            if (((isMax && v > 0) || (isMin && v < 0)) && Math.Abs(v) > most)
            {
                most = Math.Abs(v);
                peakAt = i;
            }
        }

        if (peakAt < 0)
        {
            return -1;
        }

        amplitude = w[peakAt] - level;
        var back = -Math.Sign(amplitude);

        // Steepest slope back toward the level after the peak, within the limb that follows the peak.
        var steepAt = -1;
        var steep = 0f;
        var reach = Math.Min(to, peakAt + p.DescentReach);
        for (var i = peakAt + 1; i <= reach; i++)
        {
            var v = back * d[i];
            if (v > steep)
            {
                steep = v;
                steepAt = i;
            }
        }

        if (steepAt < 0)
        {
            return -1;
        }

        // Trapezium area from the steepest point to the reference point.
        var reference = Math.Min(Math.Min(limit, qrsOnset + p.MaxQt), steepAt + p.ReferenceReach);
        if (reference <= steepAt + 1)
        {
            return -1;
        }

        var ym = w[steepAt];
        var best = -1;
        var bestArea = 0.0;
        for (var i = steepAt + 1; i <= reference; i++)
        {
            var area = 0.5 * (-back) * (ym - w[i]) * (2.0 * reference - i - steepAt);
            if (area > bestArea)
            {
                bestArea = area;
                best = i;
            }
        }

        return best;
    }
}

/// <summary>T-wave settings in samples for one sampling rate.</summary>
internal readonly record struct TWaveSamples(int StDelay, int MaxAfterQrs, int MinSearch, int Level, int DescentReach, int ReferenceReach, int MaxQt = int.MaxValue);
