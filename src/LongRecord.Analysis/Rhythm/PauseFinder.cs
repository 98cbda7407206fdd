using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// Pauses: analysable RR intervals at or above the report length (longer than the beat-gap limit they are gaps, not
/// pauses). Each is told apart as during AF, after a premature beat (class S/V/F, or an RR at least
/// <c>PrematureFraction</c> shorter than the median of the 8 intervals before it), or neither; a non-conducted P wave
/// inside it (from the beats stage) marks it as possible AV block.
/// </summary>
internal static class PauseFinder
{
    public static List<RhythmEpisode> Find(RrSeries rr, PauseSettings s, IReadOnlyList<long> nonConductedP)
    {
        var beats = rr.Beats.Span;
        var pauses = new List<RhythmEpisode>();
        Span<float> recent = stackalloc float[8];
        for (var i = 1; i < rr.Count; i++)
        {
            if (!rr.IsAnalysable(i) || rr.RrS[i] < s.ReportS)
            {
                continue;
            }

            var context = PauseContext.None;
            if (rr.Has(i, IntervalFlags.Af | IntervalFlags.AfBrief | IntervalFlags.AfLike))
            {
                context = PauseContext.DuringAf;
            }
            else if (Premature(rr, beats, i - 1, s.PrematureFraction, recent))
            {
                context = PauseContext.AfterPremature;
            }

            var a = rr.TimeS(i - 1);
            var b = rr.TimeS(i);
            pauses.Add(new RhythmEpisode
            {
                Kind = RhythmEpisode.PauseKind,
                StartS = a,
                EndS = b,
                Beats = 2,
                MeanBpm = 60.0 / (b - a),
                MaxBpm = double.NaN,
                Highlighted = b - a >= s.HighlightS,
                Context = context,
                PossibleAvBlock = HoldsNonConductedP(nonConductedP, beats[i - 1].Sample, beats[i].Sample),
            });
        }

        return pauses;
    }

    private static bool Premature(RrSeries rr, ReadOnlySpan<Beat> beats, int beat, double fraction, Span<float> recent)
    {
        if (beats[beat].Class is BeatClass.S or BeatClass.V or BeatClass.F || (beats[beat].Flags & BeatFlags.Premature) != 0)
        {
            return true;
        }

        if (beat < 1 || !rr.IsAnalysable(beat))
        {
            return false;
        }

        var count = 0;
        for (var j = beat - 1; j >= 1 && count < recent.Length && rr.IsAnalysable(j); j--)
        {
            recent[count++] = rr.RrS[j];
        }

        if (count < 3)
        {
            return false;
        }

        var window = recent[..count];
        window.Sort();
        var median = count % 2 == 1 ? window[count / 2] : 0.5f * (window[count / 2 - 1] + window[count / 2]);
        return rr.RrS[beat] < (1 - fraction) * median;
    }

    private static bool HoldsNonConductedP(IReadOnlyList<long> samples, long after, long before)
    {
        // Sorted list: binary search for the first sample after the pause's first beat.
        int lo = 0, hi = samples.Count;
        while (lo < hi)
        {
            var mid = (lo + hi) / 2;
            if (samples[mid] <= after)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }

        return lo < samples.Count && samples[lo] < before;
    }
}
