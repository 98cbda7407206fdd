using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Beats.Classification;

namespace LongRecord.Analysis.Tests.Classification;

/// <summary>
/// Worked examples of two textbook patterns (from memory): atrial bigeminy (every other beat a premature atrial beat,
/// each followed by a pause that resets the sinus node, so the premature beats are S however often they come), and a
/// premature ventricular beat behind a bundle-branch block (the normal QRS broad, 140 ms; the ectopic one from the
/// other ventricle narrower, 100 ms, of another shape, with a full compensatory pause: V, not S).
/// </summary>
public sealed class EctopyPatternTests
{
    private static readonly SyntheticBeats.Kind Sinus = SyntheticBeats.Kind.Sinus;

    [Fact]
    public void AtrialBigeminy_EveryPrematureBeatS_EverySinusBeatN()
    {
        // Sinus at 800 ms; from beat 30 to beat 89 every other beat is atrial, coupled at 560 ms and followed by a
        // 900 ms pause (sinus node reset: 1.46 s < 1.6 s).
        var beats = new List<(double TimeS, SyntheticBeats.Kind Kind)>();
        var t = 1.0;
        for (var i = 0; i < 110; i++)
        {
            var atrial = i is >= 31 and < 90 && i % 2 == 1;
            beats.Add((t, atrial ? SyntheticBeats.Kind.Atrial : Sinus));
            var nextAtrial = i + 1 is >= 31 and < 90 && (i + 1) % 2 == 1;
            t += nextAtrial ? 0.56 : atrial ? 0.90 : 0.8;
        }

        var classes = Classify(beats, t + 1, _ => float.NaN);

        for (var i = 5; i < classes.Count; i++)
        {
            var expected = beats[i].Kind == SyntheticBeats.Kind.Atrial ? BeatClass.S : BeatClass.N;
            Assert.True(expected == classes[i].Class, $"beat {i}: {classes[i].Class}, expected {expected}");
        }
    }

    [Fact]
    public void VentricularBeatNarrowerThanABlockedNormalBeat_IsV()
    {
        // Sinus at 800 ms conducted with a block (QRS 140 ms); beats 40 and 70 ventricular (QRS 100 ms), coupled at
        // 520 ms, followed by 1080 ms (full compensatory pause: 1.6 s). Widths as delineation would hand them over.
        var (beats, t) = BlockedRhythmWithTwoVentricularBeats();

        var classes = Classify(beats, t + 1, k => k == SyntheticBeats.Kind.VentricularNarrow ? 100f : 140f);

        for (var i = 5; i < classes.Count; i++)
        {
            var expected = beats[i].Kind == SyntheticBeats.Kind.VentricularNarrow ? BeatClass.V : BeatClass.N;
            Assert.True(expected == classes[i].Class, $"beat {i}: {classes[i].Class}, expected {expected}");
        }
    }

    [Fact]
    public void NarrowerBeatWhenTheNormalWidthOnlyAveragesOverTheBlockLimit_IsNotV()
    {
        // The same rhythm as above, but the normal beats' handed-over widths spread 112–140 ms (mean 125 ms, a third
        // of them under 120 ms), as a noisy record's measured widths do: a complete block widens every conducted beat
        // to at least 120 ms (AHA/ACCF/HRS 2009, from memory), so this is no evidence of one, and a beat 25 ms
        // narrower than the normal one cannot be ventricular (textbook, from memory).
        var (beats, t) = BlockedRhythmWithTwoVentricularBeats();

        float[] spread = [112, 116, 122, 128, 134, 140];
        var next = 0;
        var classes = Classify(beats, t + 1, k => k == SyntheticBeats.Kind.VentricularNarrow ? 100f : spread[next++ % spread.Length]);

        Assert.NotEqual(BeatClass.V, classes[40].Class);
        Assert.NotEqual(BeatClass.V, classes[70].Class);
    }

    // Sinus at 800 ms conducted with a block; beats 40 and 70 ventricular, coupled at 520 ms and followed by 1080 ms
    // (a full compensatory pause of 1.6 s). Returns the beats and the time after the last one.
    private static (List<(double TimeS, SyntheticBeats.Kind Kind)> Beats, double EndS) BlockedRhythmWithTwoVentricularBeats()
    {
        var beats = new List<(double TimeS, SyntheticBeats.Kind Kind)>();
        var t = 1.0;
        for (var i = 0; i < 100; i++)
        {
            var ventricular = i is 40 or 70;
            beats.Add((t, ventricular ? SyntheticBeats.Kind.VentricularNarrow : SyntheticBeats.Kind.SinusBlocked));
            t += i is 39 or 69 ? 0.52 : ventricular ? 1.08 : 0.8;
        }

        return (beats, t);
    }

    // The widths delineation would hand over, by kind; no P-wave judgement.
    private static List<ClassifiedBeat> Classify(IReadOnlyList<(double TimeS, SyntheticBeats.Kind Kind)> beats, double lengthS, Func<SyntheticBeats.Kind, float> widthMs) =>
        SyntheticBeats.Classify(beats, lengthS, (_, kind) => new BeatMeasurements(widthMs(kind), -1));
}
