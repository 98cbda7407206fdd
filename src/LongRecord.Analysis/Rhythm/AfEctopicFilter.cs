using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// Ectopic beat filtering, the AF detector's first stage: marks intervals that leave the irregularity measure —
/// around beats labelled V, F or Q; outside the conducted range (also marked as dropouts: missed or spurious
/// detections, which take no room in the detector's window); and, only where the recent kept intervals are regular,
/// around premature beats (compensated or followed by the resumed rhythm), split intervals (an extra detection) and
/// long intervals (a missed beat).
/// </summary>
internal sealed class AfEctopicFilter(AfSettings settings)
{
    private readonly AfSettings _s = settings;

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
    public void Run(RrSeries rr, ReadOnlySpan<Beat> beats)
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
            // 0: kept; 1: this interval; 2: this and the next; 3: this one as a dropout (outside the conducted
            // range: a missed or spurious detection, which says nothing about the rhythm).
            var exclude = 0;
            if (x < _s.MinConductedRrS || x > _s.MaxConductedRrS)
            {
                exclude = 3;
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
                    // A missed beat (or a long pause) in a regular rhythm: the interval alone. Not a dropout: a
                    // regular rhythm around it is evidence in itself.
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
                rr.Flags[i] |= IntervalFlags.EctopicExcluded | (exclude == 3 ? IntervalFlags.Dropout : IntervalFlags.None);
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
