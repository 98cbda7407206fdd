using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Beats.Classification;

namespace LongRecord.Analysis.Tests.Classification;

/// <summary>
/// Worked examples on synthetic beats (textbook definitions: a premature atrial beat has an abnormal P and a normal
/// QRS with a non-compensatory pause; a premature ventricular beat has no P, a broad QRS and a full compensatory
/// pause) and the streaming contract of <see cref="BeatClassifier"/>.
/// </summary>
public sealed class BeatClassifierTests
{
    [Fact]
    public void TextbookPrematureBeats_AreClassedSAndV_SinusBeatsN()
    {
        // Sinus at 800 ms; beat 40 is atrial, 560 ms early coupling, 880 ms after (sinus node reset: 1.44 s < 1.6 s);
        // beat 60 is ventricular, 520 ms coupling, 1080 ms after (full compensatory pause: 1.6 s).
        var beats = new List<(double, SyntheticBeats.Kind)>();
        var t = 1.0;
        for (var i = 0; i < 90; i++)
        {
            var kind = i == 40 ? SyntheticBeats.Kind.Atrial : i == 60 ? SyntheticBeats.Kind.Ventricular : SyntheticBeats.Kind.Sinus;
            beats.Add((t, kind));
            t += i == 39 ? 0.56 : i == 40 ? 0.88 : i == 59 ? 0.52 : i == 60 ? 1.08 : 0.8;
        }

        var classes = Classify(beats, t + 1);

        Assert.Equal(beats.Count, classes.Count);
        Assert.Equal(BeatClass.S, classes[40].Class);
        Assert.True(classes[40].Flags.HasFlag(BeatFlags.Premature));
        Assert.Equal(BeatClass.V, classes[60].Class);
        Assert.NotEqual(classes[59].Template, classes[60].Template);
        for (var i = 5; i < classes.Count; i++)
        {
            if (i != 40 && i != 60)
            {
                Assert.True(classes[i].Class == BeatClass.N, $"beat {i}: {classes[i].Class}");
            }
        }
    }

    [Fact]
    public void EachBeatIsDecidedWhenTheNextArrives_AndTheLastAtFlush()
    {
        var fs = SyntheticBeats.Fs;
        var leads = SyntheticBeats.Render([(1.0, SyntheticBeats.Kind.Sinus), (1.8, SyntheticBeats.Kind.Sinus), (2.6, SyntheticBeats.Kind.Sinus)], 4);
        var c = new BeatClassifier(fs, 2);
        Add(c, leads, 250);
        Assert.Equal(0, c.Ready);
        Add(c, leads, 450);
        Assert.Equal(1, c.Ready);
        Assert.True(c.TryTake(out var first));
        Assert.Equal(250, first.Sample);
        Add(c, leads, 650);
        c.Flush();
        Assert.Equal(2, c.Ready);
        Assert.Throws<ArgumentException>(() => Add(c, leads, 600));
    }

    [Fact]
    public void WindowWithMissingSamples_IsUnclassifiable()
    {
        var c = new BeatClassifier(SyntheticBeats.Fs, 2);
        var window = new float[2 * 301];
        Array.Fill(window, float.NaN);
        c.Add(1000, window, 301, 125, BeatMeasurements.Unknown);
        c.Flush();
        Assert.True(c.TryTake(out var b));
        Assert.Equal(BeatClass.Q, b.Class);
        Assert.Equal(-1, b.Template);
    }

    internal static List<ClassifiedBeat> Classify(IReadOnlyList<(double TimeS, SyntheticBeats.Kind Kind)> beats, double lengthS) =>
        SyntheticBeats.Classify(beats, lengthS);

    private static void Add(BeatClassifier c, float[][] leads, long fiducial) =>
        SyntheticBeats.Add(c, leads, fiducial, BeatMeasurements.Unknown);
}
