using LongRecord.Analysis.Beats;

namespace LongRecord.Analysis.Tests.Rhythm;

/// <summary>Hand-made beat lists for worked examples: beats at given RR intervals and classes.</summary>
public static class SyntheticBeats
{
    /// <summary>Beats at 1000 Hz: the first at <paramref name="firstS"/>, then one after each RR (s), with the class of each beat.</summary>
    public static Beat[] FromRr(IReadOnlyList<double> rrS, IReadOnlyList<BeatClass>? classes = null, double firstS = 1.0, sbyte pWave = -1)
    {
        var beats = new Beat[rrS.Count + 1];
        var t = firstS;
        for (var i = 0; i < beats.Length; i++)
        {
            if (i > 0)
            {
                t += rrS[i - 1];
            }

            beats[i] = Beat.Unmeasured((long)Math.Round(t * 1000), classes?[i] ?? BeatClass.N, pWave: pWave);
        }

        return beats;
    }

    public static double EndS(Beat[] beats) => beats[^1].Sample / 1000.0 + 1;
}
