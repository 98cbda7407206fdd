using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Rhythm;

namespace LongRecord.Analysis.Tests.Rhythm;

/// <summary>
/// AF detection through a beat detector that misses beats for minutes on end, as LTAFDB's unaudited <c>.qrs</c> files
/// do (record 208: intervals of 2–9 s between detections inside labelled AF). Rhythms known by construction: sinus
/// (RR 0.8 s ± 2 %) and fibrillation (independent RR draws, uniform 0.45–1.15 s: irregularly irregular, CV about
/// 0.24 — a synthetic stand-in, common practice, no source), each seen with two of every three intervals replaced by
/// a dropout (the sum of several true intervals, always above the 1.8 s conducted limit). With the window counted in
/// raw intervals, a third of them kept is too little to judge (no AF at all); dropouts take no room, so it is judged.
/// </summary>
public sealed class AfDropoutTests
{
    private const double SinusS = 300;
    private const double AfS = 1800;

    [Fact]
    public void AfSeenThroughMissedDetections_IsAf_SinusAroundItIsNot()
    {
        var random = new Random(4);
        var rr = new List<double>();
        Sinus(rr, random, SinusS, dropouts: false);
        var afStartS = rr.Sum();
        Fibrillation(rr, random, AfS);
        var afEndS = rr.Sum();
        Sinus(rr, random, SinusS, dropouts: false);
        var result = Run(rr);

        var af = result.Episodes.Where(e => e.Kind == RhythmEpisode.AfKind).ToList();
        var firstS = 1.0;
        var overlapS = af.Sum(e => Math.Max(0, Math.Min(e.EndS, firstS + afEndS) - Math.Max(e.StartS, firstS + afStartS)));
        var outsideS = af.Sum(e => e.EndS - e.StartS) - overlapS;
        // Edges blur by about half a window of kept intervals (16 kept, each followed by two dropouts of 2.3–5.8 s):
        // up to about 100 s at each end of the 1 800 s segment, hence 85 % (our tolerance, from that arithmetic).
        Assert.True(overlapS >= 0.85 * AfS, $"AF found {overlapS:F0} s of {AfS:F0} s");
        // The window reaches into the sinus stretch by at most half a window of its 0.8 s beats plus hysteresis.
        Assert.True(outsideS <= 60, $"AF called outside the AF segment for {outsideS:F0} s");
    }

    [Fact]
    public void SinusSeenThroughMissedDetections_IsNotAf()
    {
        var random = new Random(5);
        var rr = new List<double>();
        Sinus(rr, random, 3 * SinusS, dropouts: false);
        Sinus(rr, random, AfS, dropouts: true);
        Sinus(rr, random, 3 * SinusS, dropouts: false);
        var result = Run(rr);
        Assert.DoesNotContain(result.Episodes, e => e.Kind is RhythmEpisode.AfKind or RhythmEpisode.AfBriefKind);
    }

    private static RhythmResult Run(List<double> rr)
    {
        var beats = SyntheticBeats.FromRr(rr);
        return RhythmAnalyser.Analyse(new RhythmInput { Beats = beats, ReferenceRateHz = 1000, DurationS = SyntheticBeats.EndS(beats) });
    }

    // Sinus at 0.8 s ± 2 %; with dropouts, each kept interval is followed by two made of three missed beats' worth.
    private static void Sinus(List<double> rr, Random random, double durationS, bool dropouts)
    {
        var t = 0.0;
        var k = 0;
        while (t < durationS)
        {
            var parts = dropouts && k % 3 != 0 ? 3 : 1;
            var x = 0.0;
            for (var p = 0; p < parts; p++)
            {
                x += 0.8 * (1 + 0.02 * (2 * random.NextDouble() - 1));
            }

            rr.Add(x);
            t += x;
            k++;
        }
    }

    // Fibrillation: independent draws, uniform 0.45–1.15 s; every kept interval followed by two dropouts of five
    // true intervals each (2.25–5.75 s, above the 1.8 s limit).
    private static void Fibrillation(List<double> rr, Random random, double durationS)
    {
        var t = 0.0;
        var k = 0;
        while (t < durationS)
        {
            var parts = k % 3 != 0 ? 5 : 1;
            var x = 0.0;
            for (var p = 0; p < parts; p++)
            {
                x += 0.45 + 0.7 * random.NextDouble();
            }

            rr.Add(x);
            t += x;
            k++;
        }
    }
}
