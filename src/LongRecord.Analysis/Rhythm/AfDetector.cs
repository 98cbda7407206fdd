using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// Marks RR intervals that read as atrial fibrillation. The structure follows the low-latency detector of Petrėnas A,
/// Marozas V, Sörnmo L, "Low-complexity detection of atrial fibrillation in continuous long-term monitoring",
/// Comput Biol Med 2015;65:184-191, whose stages are ectopic beat filtering, bigeminal suppression, characterisation
/// of RR interval irregularity and signal fusion, on a short sliding beat window. Each stage here is our own design:
/// <list type="number">
/// <item>Ectopic beat filtering: intervals around beats labelled V, F or Q, around premature beats that are
/// compensated or followed by a resumed interval, around split intervals (an extra detection) and long intervals
/// (a missed beat), and intervals outside the conducted range, leave the series the irregularity is measured on
/// (RR rules against the median of recent kept intervals).</item>
/// <item>Bigeminal suppression: the window is searched for a repeating pattern at lags 1 … <c>MaxPatternLag</c>; a
/// rhythm whose intervals repeat at some lag (bigeminy, trigeminy, fixed conduction ratios) is organised, not
/// fibrillation.</item>
/// <item>RR irregularity: the share of large successive differences (a median criterion, robust to the odd outlier).</item>
/// <item>Signal fusion: RR criteria fused with atrial evidence where the signal gives it: consistent P waves veto,
/// absent P waves or an f-wave score relax the RR criteria; a beat whose lead carried noise gives no P finding.</item>
/// </list>
/// The window is centred on the interval judged (the analysis is offline), which places onsets and offsets within a
/// few beats, and a window in which too few intervals were kept is not judged (not AF). Dropouts — intervals outside
/// the conducted range, that is missed or spurious detections — take no room in the window: it reaches over them to
/// the intervals that carry the rhythm, so that fibrillation seen through a detector that misses beats for minutes
/// on end is still judged, while ectopic exclusions (evidence of an organised rhythm) still fill the window. O(n)
/// time; three bytes per beat of working memory besides the series' own flags.
/// </summary>
internal sealed class AfDetector(AfSettings settings)
{
    // Bits of the per-interval measure word: kept, then for each lag (1–3) "compared", "alike" and "large", then the
    // bigeminal swing and "takes room".
    internal const ushort Kept = 1;

    private readonly AfSettings _s = settings;

    // A beat's P-wave finding as atrial evidence: none where the lead carried noise around the beat, since a P wave
    // not found in noise says nothing about the atria (it would relax the RR criteria as absent P waves do).
    private static sbyte AtrialFinding(in Beat beat) => beat.LeadQuality == LeadQuality.Noisy ? (sbyte)-1 : beat.PWave;

    internal static ushort Compared(int lag) => (ushort)(1 << (3 * lag - 2));

    internal static ushort Alike(int lag) => (ushort)(1 << (3 * lag - 1));

    internal static ushort Large(int lag) => (ushort)(1 << (3 * lag));

    // Two large successive differences of opposite sign (short–long–short): the bigeminal swing.
    internal const ushort Swing = 1 << 10;

    // The interval takes room in the window: any analysable interval but a missed or spurious detection.
    internal const ushort Room = 1 << 11;

    private const byte Unjudgeable = 255;

    /// <summary>Sets <see cref="IntervalFlags.AfLike"/> and <see cref="IntervalFlags.EctopicExcluded"/> on <paramref name="rr"/>.</summary>
    public void Run(RrSeries rr, ReadOnlySpan<float> fWaveScores)
    {
        var n = rr.Count;
        var beats = rr.Beats.Span;
        new AfEctopicFilter(_s).Run(rr, beats);
        var measure = Measure(rr);
        var hasF = fWaveScores.Length == n;
        var half = _s.WindowBeats / 2;
        var w = new AfWindowCounts { Lags = Math.Min(_s.MaxPatternLag, 3) };
        var level = new byte[n];
        var s = 1;
        while (s < n)
        {
            if (!rr.IsAnalysable(s))
            {
                s++;
                continue;
            }

            var e = s;
            while (e < n && rr.IsAnalysable(e))
            {
                e++;
            }

            // Analysable run of intervals [s, e): slide a centred window [lo, hi) over it. Each side holds at most
            // its share of WindowBeats intervals that take room, and no more than needed for its share of kept ones:
            // dropouts (missed or spurious detections) take no room, so the window reaches over them to the
            // intervals that carry the rhythm, while ectopic exclusions still use up the window.
            w.Clear();
            int lo = s, hi = s, keptBefore = 0, keptAfter = 0, roomBefore = 0, roomAfter = 0;
            var wantBefore = half;
            var wantAfter = _s.WindowBeats - half;
            for (var i = s; i < e; i++)
            {
                if (i > s)
                {
                    var k = (measure[i - 1] & Kept) != 0 ? 1 : 0;
                    var r = (measure[i - 1] & Room) != 0 ? 1 : 0;
                    keptBefore += k;
                    keptAfter -= k;
                    roomBefore += r;
                    roomAfter -= r;
                }

                while (hi < e && (keptAfter < wantAfter || hi <= i) && (roomAfter < wantAfter || (measure[hi] & Room) == 0))
                {
                    w.Add(measure[hi], AtrialFinding(beats[hi]), hasF ? fWaveScores[hi] : float.NaN, +1);
                    keptAfter += (measure[hi] & Kept) != 0 ? 1 : 0;
                    roomAfter += (measure[hi] & Room) != 0 ? 1 : 0;
                    hi++;
                }

                while (lo < i && (roomBefore > wantBefore || keptBefore - ((measure[lo] & Kept) != 0 ? 1 : 0) >= wantBefore))
                {
                    w.Add(measure[lo], AtrialFinding(beats[lo]), hasF ? fWaveScores[lo] : float.NaN, -1);
                    keptBefore -= (measure[lo] & Kept) != 0 ? 1 : 0;
                    roomBefore -= (measure[lo] & Room) != 0 ? 1 : 0;
                    lo++;
                }

                level[i] = Judge(ref w, hi - lo);
                if (level[i] == Unjudgeable)
                {
                    level[i] = 0;
                    rr.Flags[i] |= IntervalFlags.Unjudged;
                }
            }

            // Hysteresis, symmetric in time: a stretch at or above the hold level is AF-like when it reaches the
            // onset level somewhere.
            for (var a = s; a < e;)
            {
                if (level[a] == 0)
                {
                    a++;
                    continue;
                }

                var b = a;
                var reaches = false;
                while (b < e && level[b] > 0)
                {
                    reaches |= level[b] == 2;
                    b++;
                }

                for (var q = a; reaches && q < b; q++)
                {
                    rr.Flags[q] |= IntervalFlags.AfLike;
                }

                a = b;
            }

            s = e;
        }
    }

    /// <summary>2: fibrillation-like at the onset level; 1: at the hold level only; 0: not.</summary>
    private byte Judge(ref AfWindowCounts w, int spanned)
    {
        // Too little kept (ectopy, artefact) to judge.
        if (w.Kept * 2 < _s.WindowBeats || w.Compared1 * 2 < _s.WindowBeats)
        {
            return Unjudgeable;
        }

        // Bigeminal suppression, second part: short and long intervals alternating beat after beat.
        if (w.Compared2 > 0 && w.Swings >= _s.BigeminalSwingShare * w.Compared2)
        {
            return 0;
        }

        // Bigeminal suppression: the best-repeating lag decides how organised the window is.
        var margin = w.IrregularityMargin();

        // Signal fusion with atrial activity, over the beats the window spans.
        var relief = 0.0;
        if (w.Judged * 2 >= spanned)
        {
            var presentShare = (double)w.Present / w.Judged;
            if (presentShare >= _s.PWavePresentVeto)
            {
                return 0;
            }

            if (presentShare <= _s.PWaveAbsentSupport)
            {
                relief = _s.AtrialRelief;
            }
        }

        if (w.FCount * 2 >= spanned && w.FSum / w.FCount >= _s.FWaveSupport)
        {
            relief = Math.Max(relief, _s.AtrialRelief);
        }

        return margin >= _s.MinIrregularityMargin - relief ? (byte)2 : margin >= _s.HoldIrregularityMargin - relief ? (byte)1 : (byte)0;
    }

    /// <summary>
    /// The per-interval measure byte: whether the interval is kept, and how it compares with the kept intervals 1, 2
    /// and 3 places before it in the same analysable run.
    /// </summary>
    private ushort[] Measure(RrSeries rr)
    {
        var n = rr.Count;
        var measure = new ushort[n];
        Span<float> previous = stackalloc float[4];
        var have = 0;
        for (var i = 1; i < n; i++)
        {
            if (!rr.IsAnalysable(i))
            {
                have = 0;
                continue;
            }

            var room = rr.Has(i, IntervalFlags.Dropout) ? (ushort)0 : Room;
            if (rr.Has(i, IntervalFlags.EctopicExcluded))
            {
                measure[i] = room;
                continue;
            }

            var x = rr.RrS[i];
            var m = (ushort)(Kept | room);
            if (have >= 2)
            {
                var d1 = x - previous[0];
                var d2 = previous[0] - previous[1];
                var large1 = Math.Abs(d1) > _s.LargeDifferenceFraction * 0.5f * (x + previous[0]);
                var large2 = Math.Abs(d2) > _s.LargeDifferenceFraction * 0.5f * (previous[0] + previous[1]);
                if (large1 && large2 && (d1 > 0) != (d2 > 0))
                {
                    m |= Swing;
                }
            }

            for (var lag = 1; lag <= Math.Min(have, 3); lag++)
            {
                var y = previous[lag - 1];
                var mean = 0.5f * (x + y);
                var d = Math.Abs(x - y);
                m |= Compared(lag);
                if (d < Math.Max(_s.AlikeFraction * mean, _s.AlikeMinS))
                {
                    m |= Alike(lag);
                }

                if (d > _s.LargeDifferenceFraction * mean)
                {
                    m |= Large(lag);
                }
            }

            measure[i] = m;
            previous[2] = previous[1];
            previous[1] = previous[0];
            previous[0] = x;
            have = Math.Min(have + 1, 3);
        }

        return measure;
    }
}
