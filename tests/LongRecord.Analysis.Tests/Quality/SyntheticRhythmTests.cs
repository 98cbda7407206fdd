using LongRecord.Analysis.Quality;
using Xunit.Abstractions;

namespace LongRecord.Analysis.Tests.Quality;

/// <summary>Rhythms that must stay analysable, and fibrillation that must be handed on, against the synthesiser's rhythm truth.</summary>
public sealed class SyntheticRhythmTests(ITestOutputHelper output)
{
    [Fact]
    public void PausesScenario_PausesAndBlockedBeats_StayAnalysable()
    {
        // pauses-and-av-block.json: sinus arrest of 2.4 and 3.2 s, blocked P waves, 44/min bradycardia, 3:2 AV block.
        var recording = QualityRun.Scenario("pauses-and-av-block");
        var windows = QualityRun.Windows(QualityRun.Render(recording), recording.SamplingRateHz);
        var pauses = recording.Truth.Rhythms.Where(r => r.Kind == "pause").ToList();
        Assert.Equal(2, pauses.Count);
        foreach (var p in pauses)
        {
            var during = windows.Where(w => w.EndS > p.StartS && w.StartS < p.EndS).ToList();
            output.WriteLine(FormattableString.Invariant($"pause {p.StartS:F2}–{p.EndS:F2} s: {string.Join(" ", during.Select(w => $"{w.State(0).Code()}/{w.State(1).Code()}"))}"));
            Assert.All(during, w => Assert.True(w.Analysable, $"{w.StartS} s: {w.Reason.Code()}"));
            Assert.All(during, w => Assert.True(w.State(0) is not LeadState.Flat && w.State(1) is not LeadState.Flat));
        }

        Assert.All(windows, w => Assert.True(w.Analysable, $"{w.StartS} s: {w.Reason.Code()}"));
    }

    [Fact]
    public void VfVflScenario_FlutterAndFibrillation_ReportedChaoticAllLeads()
    {
        // vf-vfl.json: ventricular flutter at 280/min over 20–35 s and fibrillation over 55–75 s, sinus between; the
        // truth gives both as rhythm intervals with no beats inside.
        var recording = QualityRun.Scenario("vf-vfl");
        var windows = QualityRun.Windows(QualityRun.Render(recording), recording.SamplingRateHz);
        var episodes = recording.Truth.Rhythms.Where(r => r.Kind is "ventricular-flutter" or "ventricular-fibrillation").ToList();
        Assert.Equal(2, episodes.Count);
        foreach (var e in episodes)
        {
            Assert.Equal(0, e.BeatCount);
            var inside = windows.Where(w => w.StartS >= e.StartS && w.EndS <= e.EndS).ToList();
            var chaotic = inside.Count(w => w.Reason == QualityReason.ChaoticAllLeads);
            output.WriteLine(FormattableString.Invariant($"{e.Kind} {e.StartS:F1}–{e.EndS:F1} s: {chaotic} of {inside.Count} windows chaotic-all-leads; others {string.Join(" ", inside.Where(w => w.Reason != QualityReason.ChaoticAllLeads).Select(w => $"{w.StartS}:{w.Reason.Code()}"))}"));
            Assert.True(chaotic >= 0.75 * inside.Count, $"{chaotic} of {inside.Count} {e.Kind} windows chaotic");
            Assert.DoesNotContain(inside, w => w.Reason == QualityReason.Noise);
        }

        // Sinus stretches away from the episodes (2 s margin for the two-second context) stay analysable.
        var sinus = windows.Where(w => !episodes.Any(e => w.EndS > e.StartS - 2 && w.StartS < e.EndS + 2)).ToList();
        Assert.All(sinus, w => Assert.True(w.Analysable, $"{w.StartS} s: {w.Reason.Code()}"));
    }

    [Theory]
    [InlineData("broad-tachycardia")]
    [InlineData("psvt-180")]
    [InlineData("ve-runs")]
    [InlineData("flutter-2to1-150")]
    [InlineData("af")]
    public void Tachycardias_NeverExcluded_NeverChaotic(string scenario)
    {
        // Ventricular tachycardia at 170/min with broad complexes, PSVT at 180/min, VE runs, 2:1 atrial flutter at
        // 150/min and AF at 100/min: every beat is in the truth, so no window may be excluded.
        var recording = QualityRun.Scenario(scenario);
        var windows = QualityRun.Windows(QualityRun.Render(recording), recording.SamplingRateHz);
        Assert.All(windows, w => Assert.True(w.Analysable, $"{scenario} {w.StartS} s: {w.Reason.Code()}"));
    }

    [Fact]
    public void NoiseFreeScenarios_AtLeast99PercentOfLeadWindowsGood()
    {
        string[] scenarios = ["sinus-rest", "sinus-with-pacs", "af", "psvt-180", "pauses-and-av-block", "ventricular-bigeminy",
            "broad-tachycardia", "ve-runs", "sve-runs", "flutter-2to1-150", "mat", "sinus-tachycardia"];
        int total = 0, good = 0;
        foreach (var name in scenarios)
        {
            var recording = QualityRun.Scenario(name);
            Assert.Empty(recording.Truth.Noise);
            var windows = QualityRun.Windows(QualityRun.Render(recording), recording.SamplingRateHz);
            var t = windows.Count * recording.Leads.Count;
            var g = windows.Sum(w => Enumerable.Range(0, w.LeadCount).Count(k => w.State(k) == LeadState.Good));
            output.WriteLine(FormattableString.Invariant($"{name}: {g} of {t} lead-windows good ({100.0 * g / t:F1} %)"));
            total += t;
            good += g;
        }

        output.WriteLine(FormattableString.Invariant($"pooled: {good} of {total} ({100.0 * good / total:F2} %)"));
        Assert.True(good >= 0.99 * total, $"{good} of {total} lead-windows good");
    }
}
