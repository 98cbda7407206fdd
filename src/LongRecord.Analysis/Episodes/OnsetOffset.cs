using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// Onset and offset of an episode measured on its RR intervals and its beats' P waves. The onset ratio is the median of the first five RR
/// of the episode divided by the mean of the four RR before it, after the onset criterion of Swerdlow, Chen, Kass et
/// al., "Discrimination of ventricular tachycardia from sinus tachycardia and atrial fibrillation in a tiered-therapy
/// cardioverter-defibrillator", J Am Coll Cardiol 23:1342–1355, 1994 (each RR against the mean of the previous four;
/// from memory): a median, because the first beat may be a late-coupled trigger, a premature beat in a gradual rise,
/// or in flutter a long RR before the conduction settles. The episode's median RR must have dropped as well. An onset
/// whose ratio is not low is still abrupt when the P waves before the QRS are lost from its first beats (the atrial
/// mechanism changed; <see cref="PWavesLost"/>). The offset ratio mirrors it: the median of the five RR after the
/// episode against the mean of its last four.
/// </summary>
internal static class OnsetOffset
{
    private const int Baseline = 4, EarlyBeats = 5;

    public static OnsetMeasure Onset(BeatTrack t, int first, int last, EpisodeSettings s)
    {
        var median = MedianRr(t, first + 1, last);
        var warmUp = WarmUpS(t, first, last, median, s);
        var before = MeanRr(t, first - Baseline, first - 1);
        if (!t.HasRr(first) || double.IsNaN(before))
        {
            return new OnsetMeasure("not-observed", double.NaN, "none", warmUp);
        }

        // The median of the first five intervals against the four before: one premature beat (and its pause) in a
        // gradual rise, a late-coupled trigger or one long RR before variable conduction settles does not decide it.
        var early = MedianRr(t, first, Math.Min(last, first + EarlyBeats - 1));
        var ratio = early / before;
        var faster = median / before <= s.AbruptOnsetRatio + 0.05;
        var abrupt = faster && (ratio <= s.AbruptOnsetRatio || PWavesLost(t, first, last, s));
        var trigger = "none";
        if (abrupt)
        {
            var c = t[first].Class;
            trigger = c == BeatClass.S ? "premature-atrial"
                : c == BeatClass.V ? "premature-ventricular"
                : t.RrS[first] < before * s.AbruptOnsetRatio && t.RrS[first] > (1 + s.SteadyRrFraction) * median ? "premature"
                : "none";
        }

        return new OnsetMeasure(abrupt ? "abrupt" : "gradual", ratio, trigger, warmUp);
    }

    /// <summary>
    /// The sinus P wave that stood before every QRS is gone from the episode's first beats: the atria changed mechanism
    /// at once (flutter or fibrillatory waves, or a re-entry that hides the P wave in the QRS), whatever the first RR
    /// do. A sinus node that speeds up keeps its P wave through the rise. This decides the onset of flutter with
    /// variable conduction, whose first 3:1 and 4:1 intervals can be as long as the sinus RR before it.
    /// </summary>
    private static bool PWavesLost(BeatTrack t, int first, int last, EpisodeSettings s)
    {
        var n = s.OnsetPWaveBeats;
        if (last - first + 1 < n || first - n - 1 < 0)
        {
            return false;
        }

        // PBeforeShare leaves its first beat out: these are the n beats before the onset, and the episode's first n.
        // The P waves count as standing before every QRS by the share scaled for noise (AtrialActivity.PFoundFactor): in
        // noise the sinus beats show them less often, and the test is whether the episode's first beats lost them.
        var before = AtrialActivity.PBeforeShare(t, first - n - 1, first - 1);
        var early = AtrialActivity.PBeforeShare(t, first - 1, first + n - 1);
        return before >= AtrialActivity.PFoundFactor(before, s) * s.PBeforeQrsShare && early <= s.PWaveLostFraction * before;
    }

    public static OffsetMeasure Offset(BeatTrack t, int first, int last, EpisodeSettings s)
    {
        var median = MedianRr(t, first + 1, last);
        var coolDown = CoolDownS(t, first, last, median, s);
        var end = MeanRr(t, last - Baseline + 1, last);
        if (last + 1 >= t.Count || !t.HasRr(last + 1) || double.IsNaN(end))
        {
            return new OffsetMeasure("not-observed", double.NaN, coolDown, "not-observed", double.NaN);
        }

        var after = t.RrS[last + 1];
        var following = MedianRr(t, last + 1, Math.Min(t.Count - 1, last + EarlyBeats));
        var ratio = following / end;
        var abrupt = ratio >= s.AbruptOffsetRatio;
        var nextMedian = MedianRr(t, last + 2, last + 5);
        var pause = abrupt && !double.IsNaN(nextMedian) && after >= s.PostTerminationPauseFactor * nextMedian;
        var termination = !abrupt ? "gradual" : pause ? "abrupt-with-pause" : "abrupt";
        return new OffsetMeasure(abrupt ? "abrupt" : "gradual", ratio, coolDown, termination, pause ? after : double.NaN);
    }

    /// <summary>Mean of the analysable RR ending at beats from … to; NaN unless all are analysable.</summary>
    public static double MeanRr(BeatTrack t, int from, int to)
    {
        if (from < 1 || to >= t.Count || to < from)
        {
            return double.NaN;
        }

        double sum = 0;
        for (var i = from; i <= to; i++)
        {
            if (!t.HasRr(i))
            {
                return double.NaN;
            }

            sum += t.RrS[i];
        }

        return sum / (to - from + 1);
    }

    /// <summary>Median of the analysable RR ending at beats from … to; NaN when none.</summary>
    public static double MedianRr(BeatTrack t, int from, int to)
    {
        var list = new List<float>();
        for (var i = Math.Max(1, from); i <= Math.Min(to, t.Count - 1); i++)
        {
            if (t.HasRr(i))
            {
                list.Add(t.RrS[i]);
            }
        }

        if (list.Count == 0)
        {
            return double.NaN;
        }

        list.Sort();
        return list.Count % 2 == 1 ? list[list.Count / 2] : 0.5 * (list[list.Count / 2 - 1] + list[list.Count / 2]);
    }

    private static double WarmUpS(BeatTrack t, int first, int last, double median, EpisodeSettings s)
    {
        for (var i = first; i <= last; i++)
        {
            if (t.HasRr(i) && Math.Abs(t.RrS[i] - median) <= s.SteadyRrFraction * median)
            {
                return t.TimeS(i) - t.TimeS(first);
            }
        }

        return t.TimeS(last) - t.TimeS(first);
    }

    private static double CoolDownS(BeatTrack t, int first, int last, double median, EpisodeSettings s)
    {
        for (var i = last; i > first; i--)
        {
            if (t.HasRr(i) && Math.Abs(t.RrS[i] - median) <= s.SteadyRrFraction * median)
            {
                return t.TimeS(last) - t.TimeS(i);
            }
        }

        return t.TimeS(last) - t.TimeS(first);
    }
}
