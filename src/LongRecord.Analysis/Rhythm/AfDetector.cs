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
/// absent P waves or an f-wave score relax the RR criteria.</item>
/// </list>
/// The window is centred on the interval judged (the analysis is offline), which places onsets and offsets within a
/// few beats, and a window in which too few intervals were kept is not judged (not AF). O(n) time; one byte per beat of
/// working memory besides the series' own flags.
/// </summary>
internal sealed class AfDetector(AfSettings settings)
{
    // Bits of the per-interval measure word: kept, then for each lag (1–3) "compared", "alike" and "large".
    private const ushort Kept = 1;

    private readonly AfSettings _s = settings;

    /// <summary>Development probe: per interval, the best-lag alike share and the large-difference share (NaN when not judged).</summary>
    internal float[]? ProbeAlike { get; set; }

    internal float[]? ProbeLarge { get; set; }

    private static ushort Compared(int lag) => (ushort)(1 << (3 * lag - 2));

    private static ushort Alike(int lag) => (ushort)(1 << (3 * lag - 1));

    private static ushort Large(int lag) => (ushort)(1 << (3 * lag));

    // Two large successive differences of opposite sign (short–long–short): the bigeminal swing.
    private const ushort Swing = 1 << 10;

    private const byte Unjudgeable = 255;

    /// <summary>Sets <see cref="IntervalFlags.AfLike"/> and <see cref="IntervalFlags.EctopicExcluded"/> on <paramref name="rr"/>.</summary>
    public void Run(RrSeries rr, ReadOnlySpan<float> fWaveScores)
    {
        var n = rr.Count;
        var beats = rr.Beats.Span;
        FilterEctopicBeats(rr, beats);
        var measure = Measure(rr);
        var hasF = fWaveScores.Length == n;
        var half = _s.WindowBeats / 2;
        var w = new WindowCounts { Lags = Math.Min(_s.MaxPatternLag, 3) };
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

            // Analysable run of intervals [s, e): slide a centred window [lo, hi) over it.
            w.Clear();
            int lo = s, hi = s;
            for (var i = s; i < e; i++)
            {
                var wantLo = Math.Max(s, i - half);
                var wantHi = Math.Min(e, i + _s.WindowBeats - half);
                for (; hi < wantHi; hi++)
                {
                    w.Add(measure[hi], beats[hi].PWave, hasF ? fWaveScores[hi] : float.NaN, +1);
                }

                for (; lo < wantLo; lo++)
                {
                    w.Add(measure[lo], beats[lo].PWave, hasF ? fWaveScores[lo] : float.NaN, -1);
                }

                level[i] = Judge(ref w, hi - lo, i);
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

    /// <summary>Counts over the sliding window; entries for lags 1–3.</summary>
    private struct WindowCounts
    {
        public int Lags;
        public int Kept, Judged, Present, FCount, Swings;
        public double FSum;
        public int Compared1, Compared2, Compared3, Alike1, Alike2, Alike3, Large1, Large2, Large3;

        public void Clear()
        {
            Kept = Judged = Present = FCount = Swings = 0;
            FSum = 0;
            Compared1 = Compared2 = Compared3 = Alike1 = Alike2 = Alike3 = Large1 = Large2 = Large3 = 0;
        }

        public void Add(ushort m, sbyte pWave, float fScore, int sign)
        {
            if ((m & AfDetector.Kept) != 0)
            {
                Swings += (m & Swing) != 0 ? sign : 0;
                Kept += sign;
                Large1 += (m & AfDetector.Large(1)) != 0 ? sign : 0;
                Large2 += (m & AfDetector.Large(2)) != 0 ? sign : 0;
                Large3 += (m & AfDetector.Large(3)) != 0 ? sign : 0;
                Compared1 += (m & AfDetector.Compared(1)) != 0 ? sign : 0;
                Compared2 += (m & AfDetector.Compared(2)) != 0 ? sign : 0;
                Compared3 += (m & AfDetector.Compared(3)) != 0 ? sign : 0;
                Alike1 += (m & AfDetector.Alike(1)) != 0 ? sign : 0;
                Alike2 += (m & AfDetector.Alike(2)) != 0 ? sign : 0;
                Alike3 += (m & AfDetector.Alike(3)) != 0 ? sign : 0;
            }

            // Atrial evidence of the beat that ends the interval.
            Judged += pWave >= 0 ? sign : 0;
            Present += pWave == 1 ? sign : 0;
            if (!float.IsNaN(fScore))
            {
                FCount += sign;
                FSum += sign * fScore;
            }
        }

        /// <summary>
        /// The least, over lags, of (share of large differences − share of alike pairs): high only when the rhythm
        /// is irregular at every lag, low as soon as it repeats at one (bigeminal suppression).
        /// </summary>
        public readonly double IrregularityMargin(out double alikeAtBest, out double largeAtBest)
        {
            var best = Margin(Compared1, Alike1, Large1);
            alikeAtBest = Share(Alike1, Compared1);
            largeAtBest = Share(Large1, Compared1);
            if (Lags >= 2 && Compared2 > 0 && Margin(Compared2, Alike2, Large2) < best)
            {
                best = Margin(Compared2, Alike2, Large2);
                alikeAtBest = Share(Alike2, Compared2);
                largeAtBest = Share(Large2, Compared2);
            }

            if (Lags >= 3 && Compared3 > 0 && Margin(Compared3, Alike3, Large3) < best)
            {
                best = Margin(Compared3, Alike3, Large3);
                alikeAtBest = Share(Alike3, Compared3);
                largeAtBest = Share(Large3, Compared3);
            }

            return best;
        }

        private static double Share(int count, int of) => of > 0 ? (double)count / of : 0;

        private static double Margin(int compared, int alike, int large) => compared > 0 ? (double)(large - alike) / compared : 0;
    }

    /// <summary>2: fibrillation-like at the onset level; 1: at the hold level only; 0: not.</summary>
    private byte Judge(ref WindowCounts w, int spanned, int interval)
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
        var margin = w.IrregularityMargin(out var alikeShare, out var largeShare);
        if (ProbeAlike is not null && ProbeLarge is not null)
        {
            ProbeAlike[interval] = (float)alikeShare;
            ProbeLarge[interval] = (float)largeShare;
        }

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

            if (rr.Has(i, IntervalFlags.EctopicExcluded))
            {
                continue;
            }

            var x = rr.RrS[i];
            var m = Kept;
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

    /// <summary>Median of <paramref name="recent"/>, and whether the intervals lie close about it (median absolute deviation).</summary>
    private bool Regular(ReadOnlySpan<float> recent, Span<float> scratch, out float median)
    {
        var n = recent.Length;
        recent.CopyTo(scratch);
        scratch[..n].Sort();
        median = n % 2 == 1 ? scratch[n / 2] : 0.5f * (scratch[n / 2 - 1] + scratch[n / 2]);
        for (var i = 0; i < n; i++)
        {
            scratch[i] = Math.Abs(recent[i] - median);
        }

        scratch[..n].Sort();
        var mad = n % 2 == 1 ? scratch[n / 2] : 0.5f * (scratch[n / 2 - 1] + scratch[n / 2]);
        return mad <= _s.RegularDeviationFraction * median;
    }

    /// <summary>Ectopic beat filtering: marks intervals around ectopic beats and detection artefacts as excluded.</summary>
    private void FilterEctopicBeats(RrSeries rr, ReadOnlySpan<Beat> beats)
    {
        var n = rr.Count;
        Span<float> recent = stackalloc float[8];
        Span<float> sorted = stackalloc float[8];
        var filled = 0;
        var head = 0;
        for (var i = 1; i < n; i++)
        {
            if (!rr.IsAnalysable(i))
            {
                filled = 0;
                head = 0;
                continue;
            }

            if (rr.Has(i, IntervalFlags.EctopicExcluded))
            {
                continue;
            }

            var x = rr.RrS[i];
            var next = i + 1 < n && rr.IsAnalysable(i + 1) ? rr.RrS[i + 1] : float.NaN;
            var exclude = 0;
            if (x < _s.MinConductedRrS || x > _s.MaxConductedRrS)
            {
                exclude = 1;
            }
            else if (beats[i].Class is BeatClass.V or BeatClass.F or BeatClass.Q)
            {
                exclude = 2;
            }
            else if (filled >= 4 && Regular(recent[..filled], sorted, out var reference))
            {
                // Only against a regular reference rhythm: in fibrillation "premature" and "long" lose their meaning.
                var tolerance = _s.CompensationTolerance * reference;
                if (x > _s.LongRrFactor * reference)
                {
                    // A missed beat (or a long pause): the interval alone.
                    exclude = 1;
                }
                else if (!float.IsNaN(next) && Math.Abs(x + next - reference) <= tolerance)
                {
                    // An extra detection split one interval in two.
                    exclude = 2;
                }
                else if (!float.IsNaN(next) && x < (1 - _s.PrematureFraction) * reference
                    && (Math.Abs(x + next - 2 * reference) <= tolerance || Math.Abs(next - reference) <= tolerance))
                {
                    // A premature beat, compensated or followed by the resumed rhythm.
                    exclude = 2;
                }
            }

            if (exclude > 0)
            {
                rr.Flags[i] |= IntervalFlags.EctopicExcluded;
                if (exclude == 2 && i + 1 < n)
                {
                    rr.Flags[i + 1] |= IntervalFlags.EctopicExcluded;
                }

                continue;
            }

            recent[head] = x;
            head = (head + 1) % recent.Length;
            filled = Math.Min(filled + 1, recent.Length);
        }
    }
}
