using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// Normal-to-normal intervals (Task Force of the ESC and NASPE, Circulation 1996;93:1043-1065): intervals between
/// two consecutive beats that are both normal (class N), outside AF and AF-like stretches, analysable, and that pass
/// the artefact filter — within <c>NnMaxRelativeChange</c> of the median of the 11 analysable intervals centred on
/// them (catches ectopy the labels missed, as with unlabelled annotation beats). Paced and unclassifiable beats are
/// class Q and so never NN.
/// </summary>
internal static class NnSelector
{
    private const int Neighbourhood = 11;

    public static void Mark(RrSeries rr, HrvSettings s)
    {
        var beats = rr.Beats.Span;
        var n = rr.Count;
        Span<float> scratch = stackalloc float[Neighbourhood];
        for (var i = 1; i < n; i++)
        {
            if (!rr.IsAnalysable(i) || beats[i].Class != BeatClass.N || beats[i - 1].Class != BeatClass.N
                || rr.Has(i, IntervalFlags.Af | IntervalFlags.AfBrief))
            {
                continue;
            }

            if (s.NnMaxRelativeChange > 0)
            {
                var count = 0;
                for (var j = Math.Max(1, i - Neighbourhood / 2); j <= Math.Min(n - 1, i + Neighbourhood / 2); j++)
                {
                    if (rr.IsAnalysable(j))
                    {
                        scratch[count++] = rr.RrS[j];
                    }
                }

                var window = scratch[..count];
                window.Sort();
                var median = count % 2 == 1 ? window[count / 2] : 0.5f * (window[count / 2 - 1] + window[count / 2]);
                if (Math.Abs(rr.RrS[i] - median) > s.NnMaxRelativeChange * median)
                {
                    continue;
                }
            }

            rr.Flags[i] |= IntervalFlags.Nn;
        }
    }
}
