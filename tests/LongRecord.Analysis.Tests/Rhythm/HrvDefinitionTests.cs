using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Rhythm;
using LongRecord.Analysis.Settings;
using MathNet.Numerics.Statistics;
using Xunit.Abstractions;

namespace LongRecord.Analysis.Tests.Rhythm;

/// <summary>
/// HRV indices against their definitions (Task Force of the ESC and NASPE, Circulation 1996;93:1043-1065, Table 1),
/// with expected values computed here independently (MathNet.Numerics statistics on the NN list built from the
/// labels), including ectopic exclusion.
/// </summary>
public sealed class HrvDefinitionTests(ITestOutputHelper output)
{
    // Worked example: sinus RR around 0.8 s with one PVC (short coupling, compensatory pause) and one PAC.
    private static readonly double[] s_rr = [0.80, 0.82, 0.79, 0.85, 0.50, 1.12, 0.81, 0.78, 0.90, 0.84, 0.60, 0.86, 0.80, 0.77, 0.88, 0.83];
    private static readonly BeatClass[] s_classes =
        [BeatClass.N, BeatClass.N, BeatClass.N, BeatClass.N, BeatClass.N, BeatClass.V, BeatClass.N, BeatClass.N, BeatClass.N, BeatClass.N, BeatClass.N, BeatClass.S, BeatClass.N, BeatClass.N, BeatClass.N, BeatClass.N, BeatClass.N];

    [Fact]
    public void WorkedExample_TimeDomainIndices_MatchDefinitionsWithEctopicExclusion()
    {
        var beats = SyntheticBeats.FromRr(s_rr, s_classes);
        // Labels only (artefact filter off): NN = intervals whose two beats are both N.
        var settings = AnalysisSettings.Default with { Hrv = AnalysisSettings.Default.Hrv with { NnMaxRelativeChange = 0 } };
        var result = RhythmAnalyser.Analyse(new RhythmInput { Beats = beats, ReferenceRateHz = 1000, DurationS = SyntheticBeats.EndS(beats) }, settings);

        // Independent: interval k (0-based) ends at beat k+1.
        var nn = new List<double>();
        var successive = new List<double>();
        for (var k = 0; k < s_rr.Length; k++)
        {
            var isNn = s_classes[k] == BeatClass.N && s_classes[k + 1] == BeatClass.N;
            if (isNn)
            {
                if (k > 0 && s_classes[k - 1] == BeatClass.N)
                {
                    successive.Add(s_rr[k] - s_rr[k - 1]);
                }

                nn.Add(s_rr[k]);
            }
        }

        Assert.Equal(12, nn.Count); // 16 intervals, 4 touch the V or the S beat
        var hrv = result.Summary.Hrv;
        output.WriteLine($"NN {hrv.NnCount}, SDNN {hrv.SdnnMs:F3} ms, RMSSD {hrv.RmssdMs:F3} ms, pNN50 {hrv.Pnn50Percent:F2} %, TI {hrv.TriangularIndex:F3}");
        Assert.Equal(nn.Count, hrv.NnCount);
        Assert.Equal(1000 * nn.StandardDeviation(), hrv.SdnnMs, 4); // sample SD, as MathNet; 4 places (0.1 µs): RR is held as float32
        Assert.Equal(1000 * Math.Sqrt(successive.Select(d => d * d).Average()), hrv.RmssdMs, 4);
        Assert.Equal(successive.Count, hrv.SuccessiveCount);
        var nn50 = successive.Count(d => Math.Abs(d) > 0.050);
        Assert.Equal(nn50, hrv.Nn50Count);
        Assert.Equal(100.0 * nn50 / nn.Count, hrv.Pnn50Percent, 9); // Task Force: NN50 ÷ number of NN intervals
        var height = nn.GroupBy(x => (int)Math.Floor(x * 128 + 1e-9)).Max(g => g.Count()); // bins of 1/128 s
        Assert.Equal((double)nn.Count / height, hrv.TriangularIndex, 9);
    }

    [Fact]
    public void ArtefactFilter_RemovesAnUnlabelledPrematureBeat()
    {
        // Same rhythm, every beat labelled N (as from a detector's annotation file): the 20 % rule must drop the PVC's
        // two intervals (0.50 and 1.12 s differ from their neighbourhood median of about 0.82 s by more than 20 %).
        var beats = SyntheticBeats.FromRr(s_rr);
        var result = RhythmAnalyser.Analyse(new RhythmInput { Beats = beats, ReferenceRateHz = 1000, DurationS = SyntheticBeats.EndS(beats) });
        var expected = s_rr.Where(x => x is not 0.50 and not 1.12 and not 0.60).ToList();
        Assert.Equal(expected.Count, result.Summary.Hrv.NnCount);
        Assert.Equal(1000 * expected.Average(), result.Summary.Hrv.MeanNnMs, 4);
    }

    [Fact]
    public void SdannAndSdnnIndex_FollowTheirDefinitionsOverFiveMinuteSegments()
    {
        // 20 min of NN in four 5-min segments at different mean rates, each with a small alternation.
        var rr = new List<double>();
        var means = new[] { 0.70, 0.80, 0.90, 1.00 };
        foreach (var m in means)
        {
            for (var t = 0.0; t < 300 - 1e-9;)
            {
                var x = m + (rr.Count % 2 == 0 ? 0.01 : -0.01);
                if (t + x > 300 + 1e-9)
                {
                    break;
                }

                rr.Add(x);
                t += x;
            }
        }

        var beats = SyntheticBeats.FromRr(rr, firstS: 0);
        var settings = AnalysisSettings.Default with { Hrv = AnalysisSettings.Default.Hrv with { NnMaxRelativeChange = 0 } };
        var result = RhythmAnalyser.Analyse(new RhythmInput { Beats = beats, ReferenceRateHz = 1000, DurationS = 1200 }, settings);
        var segs = result.HrvSegments.Where(s => s.Sufficient).ToList();
        Assert.Equal(4, result.HrvSegments.Count);

        // Independent: group NN by the 5-min segment holding the beat that ends each interval.
        var groups = new List<List<double>> { new(), new(), new(), new() };
        var t0 = 0.0;
        foreach (var x in rr)
        {
            t0 += x;
            groups[Math.Min(3, (int)Math.Floor(t0 / 300))].Add(x);
        }

        var segMeans = groups.Select(g => 1000 * g.Mean()).ToArray();
        var segSds = groups.Select(g => 1000 * g.StandardDeviation()).ToArray();
        output.WriteLine($"segments {segs.Count}, SDANN {result.Summary.SdannMs:F3} ms, SDNN index {result.Summary.SdnnIndexMs:F3} ms");
        Assert.Equal(4, segs.Count);
        Assert.Equal(segMeans.StandardDeviation(), result.Summary.SdannMs, 4);
        Assert.Equal(segSds.Mean(), result.Summary.SdnnIndexMs, 4);
    }

    [Theory]
    [InlineData(0.10, "lf")]
    [InlineData(0.25, "hf")]
    public void Spectrum_SinusoidalModulation_PutsItsVarianceInTheRightBand(double fHz, string band)
    {
        // NN(t) = 0.8 + A sin(2π f t): variance A²/2 belongs wholly to one band (Task Force bands). Parseval: the
        // scaled periodogram integrates to the variance; the Hann window's leakage stays within a few bins (±0.01 Hz).
        const double a = 0.03;
        var rr = new List<double>();
        var t = 0.0;
        while (t < 300)
        {
            var x = 0.8 + a * Math.Sin(2 * Math.PI * fHz * t);
            rr.Add(x);
            t += x;
        }

        var beats = SyntheticBeats.FromRr(rr, firstS: 0);
        var settings = AnalysisSettings.Default with { Hrv = AnalysisSettings.Default.Hrv with { NnMaxRelativeChange = 0 } };
        var result = RhythmAnalyser.Analyse(new RhythmInput { Beats = beats, ReferenceRateHz = 1000, DurationS = 300 }, settings);
        var seg = result.HrvSegments[0];
        var expected = a * a / 2 * 1e6;
        output.WriteLine($"f {fHz} Hz: LF {seg.LfMs2:F1} ms², HF {seg.HfMs2:F1} ms², expected {expected:F1} ms² in {band}");
        var inBand = band == "lf" ? seg.LfMs2 : seg.HfMs2;
        var other = band == "lf" ? seg.HfMs2 : seg.LfMs2;
        // 5 %: the spline through beat-time samples and the Hann window's edge taper cost a few per cent.
        Assert.InRange(inBand, 0.95 * expected, 1.05 * expected);
        Assert.True(other < 0.01 * expected, $"other band {other:F2} ms²");
    }
}
