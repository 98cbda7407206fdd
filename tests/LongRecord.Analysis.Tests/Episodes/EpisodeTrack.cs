using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Episodes;
using LongRecord.Analysis.Rhythm;

namespace LongRecord.Analysis.Tests.Episodes;

/// <summary>Hand-made beat sequences from RR intervals, as the episode stage sees them.</summary>
internal static class EpisodeTrack
{
    public const double RateHz = 250;

    /// <summary>
    /// Beats at the cumulative sums of <paramref name="rrS"/> (the first at 1 s), class N unless given, P wave not
    /// judged unless given (1 found, 0 looked for and not found), morphology template and QRS width unknown unless given.
    /// </summary>
    public static BeatTrack FromRr(IReadOnlyList<double> rrS, Func<int, BeatClass>? classOf = null, Func<int, sbyte>? pWaveOf = null,
        Func<int, short>? templateOf = null, Func<int, float>? qrsMsOf = null)
    {
        var beats = new Beat[rrS.Count + 1];
        var t = 1.0;
        for (var i = 0; i < beats.Length; i++)
        {
            if (i > 0)
            {
                t += rrS[i - 1];
            }

            beats[i] = Beat.Unmeasured((long)Math.Round(t * RateHz), classOf?.Invoke(i) ?? BeatClass.N, pWave: pWaveOf?.Invoke(i) ?? -1);
            beats[i].Template = templateOf?.Invoke(i) ?? -1;
            beats[i].QrsMs = qrsMsOf?.Invoke(i) ?? float.NaN;
        }

        return new BeatTrack(beats, RateHz, [], maxBeatGapS: 10);
    }

    public static List<double> Repeat(double rrS, int n) => Enumerable.Repeat(rrS, n).ToList();

    public static RhythmResult NoRhythm(double durationS) => RhythmAnalyser.Analyse(new RhythmInput
    {
        Beats = Array.Empty<Beat>(),
        ReferenceRateHz = RateHz,
        DurationS = durationS,
    });
}
