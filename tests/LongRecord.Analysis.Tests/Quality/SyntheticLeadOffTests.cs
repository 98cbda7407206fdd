using LongRecord.Analysis.Quality;
using Xunit.Abstractions;

namespace LongRecord.Analysis.Tests.Quality;

/// <summary>Lead-off, rail and flat stretches against the synthesiser's exact truth (<c>fixtures/scenarios/lead-off.json</c>).</summary>
public sealed class SyntheticLeadOffTests(ITestOutputHelper output)
{
    // The scenario's rail stretch sits at railMv = 5 (lead-off.json); a recorder declares its rails, and ±5 mV is the
    // range the scenario writes for its leads.
    private static readonly QualitySettings s_rails = new() { RailLowMv = [-5.0, -5.0], RailHighMv = [5.0, 5.0] };

    [Fact]
    public void LeadOffScenario_EachTruthStretch_FoundOnItsLeadsWithinOneWindow()
    {
        var recording = QualityRun.Scenario("lead-off");
        var windows = QualityRun.Windows(QualityRun.Render(recording), recording.SamplingRateHz, s_rails);
        var stretches = recording.Truth.Noise.Where(n => n.Kind == "lead-off").ToList();
        Assert.Equal(3, stretches.Count);
        foreach (var truth in stretches)
        {
            var expected = truth.LeadOffMode == "flat" ? LeadState.Flat : LeadState.Saturated;
            foreach (var label in truth.Leads)
            {
                var lead = recording.Leads.ToList().IndexOf(label);
                var found = QualityStretches.MergeLead(windows, lead)
                    .Where(s => s.State == expected && s.EndS > truth.StartS && s.StartS < truth.EndS)
                    .ToList();
                output.WriteLine(FormattableString.Invariant(
                    $"{truth.LeadOffMode} on {label}: truth {truth.StartS:F1}–{truth.EndS:F1} s, found {string.Join(", ", found.Select(s => $"{s.StartS:F1}–{s.EndS:F1}"))}"));
                var stretch = Assert.Single(found);
                // One window is one second.
                Assert.InRange(stretch.StartS, truth.StartS - SignalQualityMonitor.WindowS, truth.StartS + SignalQualityMonitor.WindowS);
                Assert.InRange(stretch.EndS, truth.EndS - SignalQualityMonitor.WindowS, truth.EndS + SignalQualityMonitor.WindowS);
            }
        }

        // Outside the stretches no lead is flat or saturated.
        foreach (var w in windows)
        {
            var inside = stretches.Any(t => w.EndS > t.StartS - 1 && w.StartS < t.EndS + 1);
            if (!inside)
            {
                for (var k = 0; k < w.LeadCount; k++)
                {
                    Assert.True(w.State(k) is not (LeadState.Flat or LeadState.Saturated), $"lead {k} {w.State(k)} at {w.StartS} s");
                }
            }
        }
    }

    [Fact]
    public void LeadOffScenario_OneLeadOff_StaysAnalysable_BothFlat_GivesFlatAllLeads()
    {
        var recording = QualityRun.Scenario("lead-off");
        var windows = QualityRun.Windows(QualityRun.Render(recording), recording.SamplingRateHz, s_rails);
        var leadCount = recording.Leads.Count;
        foreach (var truth in recording.Truth.Noise.Where(n => n.Kind == "lead-off"))
        {
            var inside = windows.Where(w => w.StartS >= truth.StartS && w.EndS <= truth.EndS).ToList();
            Assert.NotEmpty(inside);
            if (truth.Leads.Count < leadCount)
            {
                Assert.All(inside, w => Assert.True(w.Analysable, $"{w.StartS} s: {w.Reason.Code()}"));
            }
            else
            {
                Assert.All(inside, w => Assert.Equal(QualityReason.FlatAllLeads, w.Reason));
                var merged = QualityStretches.Merge(windows).Single(s => s.Reason == QualityReason.FlatAllLeads);
                Assert.Equal("flat-all-leads", merged.Reason.Code());
                Assert.False(merged.Analysable);
                Assert.InRange(merged.StartS, truth.StartS - 1, truth.StartS + 1);
                Assert.InRange(merged.EndS, truth.EndS - 1, truth.EndS + 1);
            }
        }
    }
}
