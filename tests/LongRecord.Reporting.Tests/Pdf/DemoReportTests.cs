using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;
using LongRecord.Reporting.Tests.Support;

namespace LongRecord.Reporting.Tests.Pdf;

/// <summary>
/// The report of a summarised recording, checked with an independent PDF reader (poppler's pdfinfo and pdftotext)
/// against the summary.json written beside it from the same analysis.
/// </summary>
public sealed class DemoReportTests(SummarisedDemo demo) : IClassFixture<SummarisedDemo>
{
    [Fact]
    public void Pdfinfo_AcceptsTheReport_A4Pages()
    {
        var info = Poppler.Run("pdfinfo", demo.Pdf);
        Assert.True(Poppler.Pages(demo.Pdf) >= 4, info);
        // ISO 216 A4 is 210 × 297 mm = 595.28 × 841.89 pt.
        Assert.Matches(@"Page size:\s+595\.\d+ x 841\.\d+ pts \(A4\)", info);
    }

    [Fact]
    public void OverviewText_HoldsTheFiguresOfSummaryJson()
    {
        var text = Poppler.Text(demo.Pdf, 1, 1);
        var s = demo.Summary.RootElement;
        // Decimals as summary.json's contract keeps them: rates to 0.1 bpm, percentages to 0.01 (RhythmRows.Summary).
        Assert.Contains(Count(s, "total_beats"), text);
        Assert.Contains(Number(s, "hr_min_bpm", 1) + " bpm", text);
        Assert.Contains(Number(s, "hr_mean_bpm", 1) + " bpm", text);
        Assert.Contains(Number(s, "hr_max_bpm", 1) + " bpm", text);
        Assert.Contains(Number(s, "af_burden_percent", 2) + " %", text);
        Assert.Contains(Number(s, "analysable_percent", 2) + " %", text);
        Assert.Matches($@"AF episodes \(≥ 30 s\)\s+{Count(s, "af_episode_count")}\b", text);
        Assert.Matches($@"Pauses \(RR ≥ 2\.0 s\)\s+{Count(s, "pause_count")}\b", text);
        Assert.Matches($@"Brief AF-like stretches\s+{Count(s, "af_brief_count")}\b", text);
        Assert.Matches($@"Bradycardia \(< 50 bpm, ≥ 60 s\)\s+{Count(s, "bradycardia_count")}\b", text);
        Assert.Contains(Count(s, "beats_v"), text);
        Assert.Contains(Count(s, "beats_s"), text);
        // The episodes stage's counts: flagged, couplets, and every kind found (summary.json's episodes_by_kind).
        Assert.Matches($@"Flagged for review\s+{Count(s, "episode_flagged_count")}\b", text);
        Assert.Matches($@"SVE couplets\s+{Count(s, "sve_couplet_count")}\b", text);
        Assert.Matches($@"VE couplets\s+{Count(s, "ve_couplet_count")}\b", text);
        foreach (var kind in s.GetProperty("episodes_by_kind").EnumerateObject().Where(k => k.Value.GetInt32() > 0))
        {
            Assert.Matches($@"{Regex.Escape(Reporting.Pages.ReportText.Kind(kind.Name))}\s+{kind.Value.GetInt32()}\b", text);
        }
    }

    [Fact]
    public void OverviewText_HoldsTheCautionAndTheSignOffBlock_AndThePatientAsRecorded()
    {
        var text = Poppler.Text(demo.Pdf, 1, 1);
        Assert.Contains("Automated analysis.", text);
        Assert.Contains("Reviewed by", text);
        Assert.Contains("Conclusion", text);
        // Not de-identified: the header's name and ID are shown (the de-identification test relies on this reader seeing them).
        Assert.Contains(SummarisedDemo.PatientName, text);
        Assert.Contains(SummarisedDemo.PatientId, text);
        // The demo scenario's first diary entry (fixtures/scenarios/demo-24h.json, at 8 700 s = 12:05:00 from 09:40:00).
        Assert.Contains("d1 12:05:00", text);
        Assert.Contains("walking uphill to the shop", text);
    }

    [Fact]
    public void StripsText_NamesPaperSpeedAndGain_AndEveryFullStripHasItsReason()
    {
        var pages = Poppler.Pages(demo.Pdf);
        var text = Poppler.Text(demo.Pdf, 1, pages);
        Assert.Contains("25 mm/s, 10 mm/mV", text);
        Assert.Contains("Slowest rate", text);
        Assert.Contains("Fastest rate", text);
        Assert.Contains("Patient event: walking uphill to the shop", text);
    }

    private static string Count(JsonElement s, string key) => s.GetProperty(key).GetInt32().ToString(CultureInfo.InvariantCulture);

    private static string Number(JsonElement s, string key, int decimals) => s.GetProperty(key).GetDouble().ToString("F" + decimals, CultureInfo.InvariantCulture);
}
