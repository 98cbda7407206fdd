using LongRecord.Reporting.Model;

namespace LongRecord.Benchmarks.Reporting;

/// <summary>A long report model built by hand: every hour filled, flagged episodes spread over the recording.</summary>
public static class LongReport
{
    public static ReportModel Model(double hours, int flagged)
    {
        var duration = hours * 3600;
        var start = new DateTime(2026, 3, 11, 9, 40, 0);
        var hourRows = Enumerable.Range(0, (int)Math.Ceiling(hours)).Select(i => new ReportHour
        {
            StartS = i * 3600.0, EndS = Math.Min(duration, (i + 1) * 3600.0), ClockStart = start.AddHours(i), AnalysablePercent = 95, Sufficient = true,
            MinBpm = 50 + i % 7, MeanBpm = 70 + i % 9, MaxBpm = 110 + i % 13, AfBurdenPercent = i % 5 == 0 ? 30 : 0, Sve = i, Ve = 2 * i, Pauses = i % 3,
        }).ToArray();
        var kinds = new[] { "af", "pause", "bradycardia" };
        var episodes = Enumerable.Range(0, flagged + 20).Select(i => new ReportEpisode
        {
            Kind = i < flagged ? kinds[i % 3] : "af-brief",
            StartS = (i + 0.5) * duration / (flagged + 20),
            EndS = (i + 0.5) * duration / (flagged + 20) + (i % 3 == 1 ? 3.2 : 95),
            Beats = i % 3 == 1 ? 2 : 150,
            RateBpm = 90,
            MaxBpm = 120,
            QrsMs = 90,
            QrsClass = "narrow",
            Regularity = i % 3 == 0 ? "irregular" : "",
            Evidence = "benchmark episode with a line of evidence of ordinary length for the table",
            Flagged = i < flagged,
            Rank = i + 1,
        }).ToArray();
        var bins = (int)Math.Ceiling(duration / 60);
        var rr = Enumerable.Range(0, bins).Select(i => 800f + 200 * MathF.Sin(i / 300f)).ToArray();
        return new ReportModel
        {
            Patient = new ReportPatient { Name = "Benchmark Patient", Id = "BENCH-0001", Sex = "M" },
            Recording = new ReportRecording("bench-72h", "EDF+C", start, duration, 250, ["ECG1", "ECG2"], "detected", true),
            Figures = new ReportFigures
            {
                TotalBeats = 300_000, AnalysablePercent = 95, AnalysableS = duration * 0.95, RecordingS = duration, HrMinBpm = 45, HrMeanBpm = 72, HrMaxBpm = 150,
                Slowest = new ReportPeriod(10_000, 10_010, 45), Fastest = new ReportPeriod(50_000, 50_004, 150),
                AfBurdenPercent = 5, AfEpisodeCount = 17, AfBriefCount = 20, AfLongestS = 95, AfAtStart = false, AfAtEnd = false, AfBurdenPerDayPercent = [4, 5, 6],
                PauseCount = 17, PauseHighlightedCount = 17, PauseLongestS = 3.2, BradycardiaCount = 16,
                BeatsByClass = [new("N", 290_000), new("S", 5000), new("V", 4000), new("F", 0), new("Q", 1000)],
                SdnnMs = 140, SdannMs = 120, SdnnIndexMs = 50, RmssdMs = 30, Pnn50Percent = 10, HrvTriangularIndex = 30, LfMs2 = 300, HfMs2 = 200, LfHfRatio = 1.5, HrvExcludedS = 3000,
            },
            Hours = hourRows,
            Episodes = episodes,
            EpisodeCounts = [new("af", 17), new("pause", 17), new("bradycardia", 16), new("af-brief", 20)],
            Symptoms = Enumerable.Range(0, 6).Select(i => new ReportSymptom(i * 40_000 + 500, "palpitations", "no episode found", 80)).ToArray(),
            Distributions = new RhythmDistributions
            {
                TachogramBinS = 60, RrMinMs = rr.Select(v => v - 150).ToArray(), RrMeanMs = rr, RrMaxMs = rr.Select(v => v + 150).ToArray(),
                ScatterMinMs = 200, ScatterStepMs = 20, ScatterBins = 90, ScatterCounts = Enumerable.Range(0, 8100).Select(i => (i * 7919) % 97 < 30 ? i % 500 : 0).ToArray(),
                HistogramMinBpm = 20, HistogramStepBpm = 5, HistogramCounts = Enumerable.Range(0, 46).Select(i => (int)(20000 * Math.Exp(-Math.Pow((i - 10) / 4.0, 2)))).ToArray(),
            },
            Thresholds = new ReportThresholds(2, 3, 50, 60, 30),
            ToolVersion = "bench",
        };
    }
}

/// <summary>Two synthetic leads at 250 Hz, a beat every 0.8 s; computed per window like a reader would deliver them.</summary>
public sealed class BenchmarkStrips : IStripSource
{
    private readonly StripSignal _signal = new(2, 2600);

    public IReadOnlyList<string> LeadLabels { get; } = ["ECG1", "ECG2"];

    public StripSignal Read(double startS, double durationS)
    {
        var count = (int)Math.Round(durationS * 250);
        _signal.Reset(startS, 250, count);
        for (var i = 0; i < count; i++)
        {
            var phase = (startS + i / 250.0) % 0.8;
            var v = 1.2 * Math.Exp(-Math.Pow((phase - 0.3) / 0.012, 2)) + 0.3 * Math.Exp(-Math.Pow((phase - 0.55) / 0.045, 2)) + 0.02 * Math.Sin(i * 0.7);
            _signal.Samples[i] = (float)v;
            _signal.Samples[count + i] = (float)(-0.6 * v);
        }

        for (var k = Math.Ceiling(startS / 0.8); k * 0.8 < startS + durationS; k++)
        {
            _signal.Beats.Add(new StripBeat(k * 0.8 + 0.3, 'N'));
        }

        return _signal;
    }
}
