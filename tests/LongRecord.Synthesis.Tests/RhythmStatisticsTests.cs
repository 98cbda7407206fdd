namespace LongRecord.Synthesis.Tests;

/// <summary>RR statistics measured on R peaks found in the rendered signal, inside the truth rhythm intervals.</summary>
public sealed class RhythmStatisticsTests
{
    private static List<double> MeasuredRr(SyntheticRecording rec, double fromS, double toS)
    {
        var leads = SignalProbe.Render(rec, 0, (int)rec.SampleCount);
        var peaks = SignalProbe.FindRPeaks(leads, rec.SamplingRateHz).Select(p => p / rec.SamplingRateHz).Where(t => t >= fromS && t <= toS).ToList();
        return peaks.Zip(peaks.Skip(1), (a, b) => b - a).ToList();
    }

    // Thresholds: AF CV > 0.15 and resting sinus CV < 0.08 (common practice, no source; the issue's criteria).
    [Fact]
    public void AfSegment_RrCoefficientOfVariationAbove015()
    {
        var rec = ScenarioFiles.Recording("af");
        var af = SignalProbe.Segment(rec, "af");
        var cv = SignalProbe.CoefficientOfVariation(MeasuredRr(rec, af.StartS, af.EndS));
        Assert.True(cv > 0.15, $"AF RR CV {cv:0.000}");
    }

    [Fact]
    public void RestingSinus_RrCoefficientOfVariationBelow008()
    {
        var rec = ScenarioFiles.Recording("sinus-rest");
        var cv = SignalProbe.CoefficientOfVariation(MeasuredRr(rec, 0, rec.DurationS));
        Assert.True(cv < 0.08, $"sinus RR CV {cv:0.000}");
        Assert.True(cv > 0.01, $"sinus RR CV {cv:0.000}: a real sinus rhythm varies");
    }

    // Successive AF RR intervals are uncorrelated ("irregularly irregular"); |lag-1 autocorrelation| < 0.2 (our tolerance
    // for ~400 intervals, where the standard error of an uncorrelated estimate is about 0.05).
    [Fact]
    public void AfSegment_SuccessiveRrUncorrelated()
    {
        var rec = ScenarioFiles.Recording("af");
        var af = SignalProbe.Segment(rec, "af");
        var rr = MeasuredRr(rec, af.StartS, af.EndS);
        var mean = rr.Average();
        var num = rr.Zip(rr.Skip(1), (a, b) => (a - mean) * (b - mean)).Sum();
        var den = rr.Sum(v => (v - mean) * (v - mean));
        Assert.True(Math.Abs(num / den) < 0.2, $"lag-1 autocorrelation {num / den:0.000}");
    }

    // Circadian rhythm: the issue asks for about 55 bpm at night and 75 bpm by day; we require a night hour at least
    // 10 bpm below a day hour and each within ±8 bpm of the scenario's night and day rates (our tolerance: ectopy and
    // the activity drift move an hour's mean by a few bpm).
    [Fact]
    public void Demo_NightHourMeanRateBelowDayHour()
    {
        var rec = ScenarioFiles.Recording("demo-24h", rateHz: 128);
        var dayStart = (new DateTime(2026, 3, 11, 15, 30, 0) - rec.StartDateTime).TotalSeconds;
        var nightStart = (new DateTime(2026, 3, 12, 3, 30, 0) - rec.StartDateTime).TotalSeconds;
        double MeanRate(double fromS)
        {
            var first = (long)(fromS * rec.SamplingRateHz);
            var count = (int)(3600 * rec.SamplingRateHz);
            var leads = SignalProbe.Render(rec, first, count);
            var peaks = SignalProbe.FindRPeaks(leads, rec.SamplingRateHz);
            return 60.0 * (peaks.Count - 1) / ((peaks[^1] - peaks[0]) / rec.SamplingRateHz);
        }

        var day = MeanRate(dayStart);
        var night = MeanRate(nightStart);
        Assert.True(night < day - 10, $"night {night:0.0} bpm, day {day:0.0} bpm");
        Assert.InRange(night, rec.Scenario.Circadian.NightRateBpm - 8, rec.Scenario.Circadian.NightRateBpm + 8);
        Assert.InRange(day, rec.Scenario.Circadian.DayRateBpm - 8, rec.Scenario.Circadian.DayRateBpm + 8);
    }

    // Sinus tachycardia ramps gradually: no two successive measured RR differ by more than 10 % inside it, and the
    // rate passes 100 bpm only after 20 s (our criteria for "gradual over tens of seconds").
    [Fact]
    public void SinusTachycardia_RampsGraduallyAboveHundred()
    {
        var rec = ScenarioFiles.Recording("sinus-tachycardia");
        var st = SignalProbe.Segment(rec, "sinus-tachycardia");
        var rr = MeasuredRr(rec, st.StartS, st.EndS);
        var jumps = rr.Zip(rr.Skip(1), (a, b) => Math.Abs(b - a) / a).Max();
        Assert.True(jumps < 0.10, $"largest beat-to-beat RR change {jumps:P1}");
        Assert.True(rr.Min() < 60.0 / 125, $"fastest RR {rr.Min():0.000} s");
        var above = st.Parameters["rateAbove100FromS"];
        Assert.True(above - st.StartS > 20, $"rate above 100 after {above - st.StartS:0.0} s");
    }

    // PSVT: near-constant RR (our tolerance: CV < 0.01) at the scripted rate ± 2 %.
    [Fact]
    public void Psvt_RegularAtScriptedRate()
    {
        var rec = ScenarioFiles.Recording("psvt-180");
        var psvt = SignalProbe.Segment(rec, "psvt");
        var rr = MeasuredRr(rec, psvt.StartS + 1, psvt.EndS);
        Assert.True(SignalProbe.CoefficientOfVariation(rr) < 0.01, $"PSVT RR CV {SignalProbe.CoefficientOfVariation(rr):0.0000}");
        Assert.InRange(60.0 / rr.Average(), 180 * 0.98, 180 * 1.02);
    }

    // MAT: rate above 100 and irregular (our criterion: RR CV above 0.06).
    [Fact]
    public void MultifocalAtrialTachycardia_FastAndIrregular()
    {
        var rec = ScenarioFiles.Recording("mat");
        var mat = SignalProbe.Segment(rec, "mat");
        var rr = MeasuredRr(rec, mat.StartS, mat.EndS);
        Assert.True(60.0 / rr.Average() > 100, $"mean rate {60.0 / rr.Average():0.0}");
        Assert.True(SignalProbe.CoefficientOfVariation(rr) > 0.06, $"CV {SignalProbe.CoefficientOfVariation(rr):0.000}");
        Assert.True(rec.Truth.Beats.Where(b => b.RTimeS >= mat.StartS && b.RTimeS <= mat.EndS).Select(b => b.PShape).Distinct().Count() >= 3);
    }

    // Sinus bradycardia below 50 bpm (its definition, common practice, no source) and sinus arrest pauses of the
    // scripted length: the longest measured RR in each pause within 10 ms of it (the R-time criterion of the issue).
    [Fact]
    public void BradycardiaAndPauses_MeasuredOnTheSignal()
    {
        var rec = ScenarioFiles.Recording("pauses-and-av-block");
        var brady = SignalProbe.Segment(rec, "sinus-bradycardia");
        var rr = MeasuredRr(rec, brady.StartS, brady.EndS);
        Assert.True(60.0 / rr.Average() < 50, $"bradycardia at {60.0 / rr.Average():0.0} bpm");
        foreach (var pause in rec.Truth.Rhythms.Where(r => r.Kind == "pause"))
        {
            var longest = MeasuredRr(rec, pause.StartS - 0.01, pause.EndS + 0.01).Max();
            Assert.True(Math.Abs(longest - pause.Parameters["durationS"]) <= 0.01, $"pause {longest:0.000} s, scripted {pause.Parameters["durationS"]} s");
            Assert.InRange(longest, 2.0, 4.0);
        }
    }
}
