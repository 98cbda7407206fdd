using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Rhythm;
using LongRecord.Synthesis;
using LongRecord.Synthesis.Scenarios;
using Xunit.Abstractions;

namespace LongRecord.Analysis.Tests.Rhythm;

/// <summary>
/// The synthesised 24 h demo scenario (fixtures/scenarios/demo-24h.json, LongRecord.Synthesis) with its exact truth:
/// AF segments and pauses known by construction. Input here is the truth beats (the integrator repeats this on
/// detected beats).
/// </summary>
public sealed class SyntheticDayTests(ITestOutputHelper output)
{
    private static readonly Lazy<SyntheticRecording> s_day = new(() => SyntheticRecording.Create(ScenarioLoader.Load(ScenarioPath("demo-24h"))));

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Demo24h_AfBurdenWithinHalfAPoint_PauseCountExact(bool withPWaves)
    {
        var rec = s_day.Value;
        var truth = rec.Truth;
        var beats = new Beat[truth.Beats.Count];
        var i = 0;
        foreach (var b in truth.Beats)
        {
            // With P waves: a P before the QRS (sinus or ectopic) counts as present, none as absent.
            var beatClass = b.Class switch { Synthesis.Truth.BeatClass.S => BeatClass.S, Synthesis.Truth.BeatClass.V => BeatClass.V, _ => BeatClass.N };
            var pWave = !withPWaves ? (sbyte)-1 : b.PWave is Synthesis.Truth.PWaveKind.Sinus or Synthesis.Truth.PWaveKind.Ectopic ? (sbyte)1 : (sbyte)0;
            beats[i++] = Beat.Unmeasured(b.RSample, beatClass, pWave: pWave);
        }

        var result = RhythmAnalyser.Analyse(new RhythmInput
        {
            Beats = beats,
            ReferenceRateHz = rec.SamplingRateHz,
            DurationS = rec.DurationS,
            StartDateTime = rec.StartDateTime,
            NonConductedPSamples = truth.PWaves.Where(p => p.IsNonConducted).Select(p => p.PeakSample).ToArray(),
        });

        var afTruthS = truth.Rhythms.Where(r => r.Kind == "af" && !r.IsEpisode).Sum(r => r.DurationS);
        var truthBurden = 100 * afTruthS / result.Summary.AnalysableS;
        var truthPauses = truth.Rhythms.Where(r => r.Kind == "pause" && r.DurationS >= 2.0).ToList();

        // A blocked P leaves an RR of about two cycles: by the product's rule (RR ≥ 2.0 s) that is a pause too, and the
        // truth says why (a non-conducted P inside it).
        var times = truth.Beats.Select(b => b.RTimeS).ToArray();
        var blocked = truth.PWaves.Where(p => p.IsNonConducted).Select(p =>
        {
            var k = Array.FindIndex(times, t => t > p.PeakS);
            return (Start: times[k - 1], Rr: times[k] - times[k - 1]);
        }).Where(x => x.Rr >= 2.0).ToList();
        output.WriteLine($"P waves {(withPWaves ? "from truth" : "not judged")}: truth AF {afTruthS:F0} s, burden {truthBurden:F3} %; ours {result.Summary.AfS:F0} s, {result.Summary.AfBurdenPercent:F3} % in {result.Summary.AfEpisodeCount} episodes");
        output.WriteLine($"truth blocked P with RR ≥ 2 s: {blocked.Count}");
        output.WriteLine($"truth pauses ≥ 2 s: {string.Join(", ", truthPauses.Select(p => $"{p.StartS:F0} s {p.DurationS:F2} s"))}; ours: {string.Join(", ", result.Episodes.Where(e => e.Kind == "pause").Select(p => $"{p.StartS:F0} s {p.DurationS:F2} s {RhythmRows.ContextWord(p.Context)}{(p.PossibleAvBlock ? " AV?" : "")}"))}");
        output.WriteLine($"HR {result.Summary.HrMinBpm:F0}/{result.Summary.HrMeanBpm:F0}/{result.Summary.HrMaxBpm:F0} bpm, SDNN {result.Summary.Hrv.SdnnMs:F1} ms, rows {result.Trend.Count}, first row {result.Trend[0].ClockStart:HH:mm}");
        Assert.InRange(result.Summary.AfBurdenPercent, truthBurden - 0.5, truthBurden + 0.5);
        Assert.Equal(truthPauses.Count + blocked.Count, result.Summary.PauseCount);
        foreach (var b in blocked)
        {
            Assert.Contains(result.Episodes, e => e.Kind == "pause" && Math.Abs(e.StartS - b.Start) < 0.01 && e.PossibleAvBlock);
        }
    }

    private static string ScenarioPath(string name)
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "fixtures", "scenarios", name + ".json");
            if (File.Exists(candidate))
            {
                return candidate;
            }
        }

        throw new FileNotFoundException($"fixtures/scenarios/{name}.json not found above {AppContext.BaseDirectory}");
    }
}
