using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Quality;
using LongRecord.Analysis.Tests.Support;

namespace LongRecord.Analysis.Tests.Quality;

/// <summary>
/// The monitor's contract on inputs built from MITDB record 100 (clean sinus rhythm, 2 leads, 360 Hz, rails ±5.12 mV
/// from its header): gaps, rails and flat leads placed by the test, so the expected states follow from the construction.
/// </summary>
public sealed class MonitorContractTests
{
    private static readonly Lazy<ReferenceRecord> s_record = new(() => ReferenceRecord.Load("mitdb", "100"));

    private static (float[][] Leads, double Fs, QualitySettings Rails) FirstSeconds(int seconds)
    {
        var r = s_record.Value;
        var n = (int)(seconds * r.SamplingRateHz);
        return (r.Leads.Select(l => l.AsSpan(0, n).ToArray()).ToArray(), r.SamplingRateHz, QualityRun.RailsOf(r));
    }

    private static IEnumerable<QualityWindow> Inside(List<QualityWindow> windows, double fromS, double toS) =>
        windows.Where(w => w.StartS >= fromS && w.EndS <= toS);

    [Fact]
    public void Gaps_OneLeadMissingStaysAnalysable_BothMissingGiveMissing()
    {
        var (leads, fs, rails) = FirstSeconds(120);
        leads[0].AsSpan((int)(30 * fs), (int)(20 * fs)).Fill(float.NaN);
        leads[0].AsSpan((int)(70 * fs), (int)(10 * fs)).Fill(float.NaN);
        leads[1].AsSpan((int)(70 * fs), (int)(10 * fs)).Fill(float.NaN);
        var windows = QualityRun.Windows(leads, fs, rails);
        Assert.All(Inside(windows, 30, 50), w => Assert.Equal((LeadState.Missing, true), (w.State(0), w.Analysable)));
        Assert.All(Inside(windows, 30, 50), w => Assert.True(w.State(1).IsUsable()));
        Assert.All(Inside(windows, 70, 80), w => Assert.Equal(QualityReason.Missing, w.Reason));
        Assert.All(Inside(windows, 0, 29), w => Assert.Equal(QualityReason.Ok, w.Reason));
    }

    [Fact]
    public void Rails_StuckLeadSaturated_BothStuckGiveSaturation_FlatAndRailGiveLeadOff()
    {
        var (leads, fs, rails) = FirstSeconds(120);
        var high = (float)rails.RailHighMv![0];
        leads[0].AsSpan((int)(20 * fs), (int)(10 * fs)).Fill(high);
        leads[0].AsSpan((int)(50 * fs), (int)(10 * fs)).Fill(high);
        leads[1].AsSpan((int)(50 * fs), (int)(10 * fs)).Fill((float)rails.RailLowMv![1]);
        leads[0].AsSpan((int)(80 * fs), (int)(10 * fs)).Fill(0.25f);
        leads[1].AsSpan((int)(80 * fs), (int)(10 * fs)).Fill((float)rails.RailHighMv![1]);
        var windows = QualityRun.Windows(leads, fs, rails);
        Assert.All(Inside(windows, 20, 30), w => Assert.Equal((LeadState.Saturated, QualityReason.Ok), (w.State(0), w.Reason)));
        Assert.All(Inside(windows, 50, 60), w => Assert.Equal(QualityReason.Saturation, w.Reason));
        Assert.All(Inside(windows, 80, 90), w => Assert.Equal((LeadState.Flat, LeadState.Saturated, QualityReason.LeadOff), (w.State(0), w.State(1), w.Reason)));
    }

    [Fact]
    public void ClippedQrsPeaks_NotSaturated_ClippingPlateauWithoutRails_Saturated()
    {
        var (leads, fs, _) = FirstSeconds(90);
        // R peaks of lead 0 cut at +0.3 mV over 10–40 s: short plateaus on each complex; the lead still shows its beats.
        for (var i = (int)(10 * fs); i < (int)(40 * fs); i++)
        {
            leads[0][i] = Math.Min(leads[0][i], 0.3f);
        }

        // Over 60–70 s lead 1 is pinned, each second, at that second's 25th percentile: three quarters of the samples sit
        // on a plateau at the window's maximum, the deepest quarter still moves.
        for (var second = 60; second < 70; second++)
        {
            var stretch = leads[1].AsSpan((int)(second * fs), (int)fs);
            var sorted = stretch.ToArray();
            Array.Sort(sorted);
            var limit = sorted[sorted.Length / 4];
            foreach (ref var x in stretch)
            {
                x = Math.Min(x, limit);
            }
        }

        var windows = QualityRun.Windows(leads, fs);
        Assert.All(Inside(windows, 11, 39), w => Assert.NotEqual(LeadState.Saturated, w.State(0)));
        Assert.All(Inside(windows, 60, 70), w => Assert.Equal(LeadState.Saturated, w.State(1)));
    }

    [Fact]
    public void Queries_FollowTheFinishedWindows()
    {
        var (leads, fs, rails) = FirstSeconds(60);
        leads[1].AsSpan((int)(20 * fs), (int)(10 * fs)).Fill(0.1f);
        var monitor = new SignalQualityMonitor(fs, 2, rails);
        var n = leads[0].Length;
        var conditioned = leads.Select(l => { var c = (float[])l.Clone(); new LongRecord.Analysis.Conditioning.EcgConditioner(fs).Process(c); return c; }).ToArray();
        var raw = new float[2 * n];
        var cond = new float[2 * n];
        for (var k = 0; k < 2; k++)
        {
            leads[k].CopyTo(raw, k * n);
            conditioned[k].CopyTo(cond, k * n);
        }

        var half = n / 2;
        monitor.Process(Lane(raw, n, 0, half), Lane(cond, n, 0, half), half);
        Assert.True(monitor.DecidedUntilSample >= half - monitor.LatencySamples, $"decided until {monitor.DecidedUntilSample} of {half}");
        Assert.False(monitor.TryGetLeadState(0, half - 1, out _));
        Assert.Throws<ArgumentOutOfRangeException>(() => monitor.LeadStateAt(0, half - 1));
        var windows = monitor.Finished.ToList();
        monitor.Process(Lane(raw, n, half, n - half), Lane(cond, n, half, n - half), n - half);
        windows.AddRange(monitor.Finished);
        monitor.Flush();
        windows.AddRange(monitor.Finished);
        Assert.Equal(60, windows.Count);
        Assert.Equal(n, monitor.DecidedUntilSample);
        Assert.Equal(QualityStretches.Merge(windows), monitor.Stretches);
        foreach (var w in windows)
        {
            for (var k = 0; k < 2; k++)
            {
                Assert.Equal(w.State(k), monitor.LeadStateAt(k, w.StartSample));
                Assert.Equal(w.State(k), monitor.LeadStateAt(k, w.EndSample - 1));
            }

            Assert.Equal(w.Analysable, monitor.IsAnalysableAt(w.StartSample));
        }

        // Lead 1 flat over 20–30 s: beats there are seen on one usable lead only.
        Assert.Equal(LeadQuality.SingleLead, monitor.BeatLeadQuality((long)(25 * fs)));
        Assert.Equal(LeadQuality.Good, monitor.BeatLeadQuality((long)(45 * fs)));
        Assert.Equal(QualityStretches.MergeLead(windows, 1), monitor.LeadStretches(1));
        Assert.Throws<InvalidOperationException>(() => monitor.Process(raw, cond, 1));
    }

    // Lead-major sub-block [from, from + count) of two leads stored lead after lead with n samples each.
    private static float[] Lane(float[] data, int n, int from, int count)
    {
        var block = new float[2 * count];
        for (var k = 0; k < 2; k++)
        {
            data.AsSpan(k * n + from, count).CopyTo(block.AsSpan(k * count, count));
        }

        return block;
    }

    [Fact]
    public void AnalysableSecondsPerHour_SumsAnalysableStretchesByClockHour()
    {
        QualityStretch S(double a, double b, bool ok) => new((long)(a * 100), (long)(b * 100), a, b, ok, ok ? QualityReason.Ok : QualityReason.Noise);
        var perHour = QualityStretches.AnalysableSecondsPerHour([S(0, 3500, true), S(3500, 3700, false), S(3700, 7300, true), S(7300, 7400, false)]);
        Assert.Equal([3500.0, 3500.0, 100.0], perHour);
    }

    [Fact]
    public void ReasonAndStateCodes_AreTheQualityCsvCodes()
    {
        // quality.csv: reason codes named in the beats issue; lead_quality in beats.csv uses good / noisy / single-lead.
        Assert.Equal(
            ["ok", "noise", "lead-off", "saturation", "missing", "flat-all-leads", "chaotic-all-leads"],
            Enum.GetValues<QualityReason>().Select(r => r.Code()));
        Assert.Equal(
            ["good", "noisy", "unreadable", "chaotic", "flat", "saturated", "missing"],
            Enum.GetValues<LeadState>().Select(s => s.Code()));
    }

    [Fact]
    public void BadArguments_Rejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new SignalQualityMonitor(20, 2));
        Assert.Throws<ArgumentOutOfRangeException>(() => new SignalQualityMonitor(double.NaN, 2));
        Assert.Throws<ArgumentOutOfRangeException>(() => new SignalQualityMonitor(250, 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => new SignalQualityMonitor(250, QualityWindow.MaxLeads + 1));
        var e = Assert.Throws<ArgumentException>(() => new SignalQualityMonitor(250, 2, new QualitySettings { RailLowMv = [-5.0], FlatRangeMv = -1, UnreadableMinWindows = 4 }));
        Assert.Contains("3 problem(s)", e.Message);
        var monitor = new SignalQualityMonitor(250, 2);
        Assert.Throws<ArgumentException>(() => monitor.Process(new float[10], new float[20], 10));
        Assert.Throws<ArgumentOutOfRangeException>(() => monitor.Process(new float[10], new float[10], -1));
    }
}
