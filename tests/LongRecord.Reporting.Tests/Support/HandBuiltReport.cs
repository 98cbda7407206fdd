using LongRecord.Reporting.Model;

namespace LongRecord.Reporting.Tests.Support;

/// <summary>
/// A fixed report model written out by hand (an invented patient of the invented Saltmarsh Lane unit), independent of
/// the analysis, so the golden images move only when the layout does.
/// </summary>
public static class HandBuiltReport
{
    public static readonly DateTime Start = new(2026, 3, 11, 9, 40, 0);

    public static ReportModel Model(double hours = 24)
    {
        var duration = hours * 3600;
        var hoursList = new List<ReportHour>();
        var first = 3600 - 40 * 60.0;
        for (var (s, i) = (0.0, 0); s < duration; i++)
        {
            var e = Math.Min(duration, i == 0 ? first : s + 3600);
            var night = i is >= 13 and <= 21;
            var sufficient = i != 5;
            hoursList.Add(new ReportHour
            {
                StartS = s, EndS = e, ClockStart = Start.AddSeconds(s), AnalysablePercent = sufficient ? 96 - i % 4 : 31, Sufficient = sufficient,
                MinBpm = sufficient ? (night ? 48 : 62) + i % 3 : double.NaN, MeanBpm = sufficient ? (night ? 56 : 74) + i % 5 : double.NaN,
                MaxBpm = sufficient ? (night ? 70 : 112) + 4 * (i % 4) : double.NaN, AfBurdenPercent = i == 8 ? 66.5 : 0, Sve = 10 + i, Ve = 30 + 2 * i, Pauses = i == 17 ? 1 : 0,
            });
            s = e;
        }

        var episodes = new List<ReportEpisode>
        {
            new() { Kind = "pause", StartS = 62999.56, EndS = 63003.16, Beats = 2, RateBpm = 16.7, Evidence = "RR 3.60 s (pauses from 2.0 s, flagged from 3.0 s), after a premature beat", Flagged = true, Urgent = true, Rank = 1 },
            new() { Kind = "af", StartS = 31202.98, EndS = 33599.64, Beats = 4184, RateBpm = 104.7, MaxBpm = 136.2, QrsMs = 86, QrsClass = "narrow", Regularity = "irregular", Evidence = "irregular RR with no consistent P waves for 0:39:57 (AF episodes from 30 s)", Flagged = true, Rank = 2 },
            new() { Kind = "bradycardia", StartS = 55000, EndS = 55190, Beats = 148, RateBpm = 46.7, MaxBpm = 49.5, QrsMs = 88, QrsClass = "narrow", Evidence = "8-beat average rate below 50 bpm for 0:03:10 (from 60 s), lowest 44 bpm", Flagged = true, Rank = 3 },
            new() { Kind = "af-brief", StartS = 40100, EndS = 40112.5, Beats = 21, RateBpm = 101, MaxBpm = 118, Regularity = "irregular", Evidence = "AF-like irregular RR for 12.5 s, shorter than 30 s: not counted in the AF burden", Flagged = false, Rank = 4 },
            new() { Kind = "pause", StartS = 69599.16, EndS = 69601.29, Beats = 2, RateBpm = 28.1, Evidence = "RR 2.13 s (pauses from 2.0 s, flagged from 3.0 s)", Flagged = false, Rank = 5, OffsetObserved = true },
        };
        return new ReportModel
        {
            Patient = new ReportPatient { Name = "Tamsin Okafor-Lindgren", Id = "SLU-2026-0932", BirthDate = "1961-04-02", Sex = "F" },
            Recording = new ReportRecording("hand-built", "EDF+C", Start, duration, 250, ["ECG1", "ECG2"], "detected", true),
            Figures = new ReportFigures
            {
                TotalBeats = 93177, AnalysablePercent = 97.42, AnalysableS = 84170.9, RecordingS = duration,
                HrMinBpm = 44.2, HrMeanBpm = 64.7, HrMaxBpm = 186.3,
                Slowest = new ReportPeriod(55100, 55108.9, 44.2), Fastest = new ReportPeriod(13281, 13283.6, 186.3),
                AfBurdenPercent = 2.77, AfEpisodeCount = 1, AfBriefCount = 1, AfLongestS = 2396.66, AfAtStart = false, AfAtEnd = false, AfBurdenPerDayPercent = [2.77],
                PauseCount = 2, PauseHighlightedCount = 1, PauseLongestS = 3.6, BradycardiaCount = 1,
                BeatsByClass = [new("N", 91014), new("S", 574), new("V", 901), new("F", 0), new("Q", 688)],
                SdnnMs = 164.5, SdannMs = 144.3, SdnnIndexMs = 35.9, RmssdMs = 35.1, Pnn50Percent = 16.73, HrvTriangularIndex = 22.77,
                LfMs2 = 215.6, HfMs2 = 549.9, LfHfRatio = 0.414, HrvExcludedS = 4920,
            },
            Hours = hoursList,
            Episodes = episodes,
            EpisodeCounts = [new("af", 1), new("af-brief", 1), new("pause", 2), new("bradycardia", 1)],
            Symptoms =
            [
                new ReportSymptom(8700, "walking uphill to the shop", "no episode found", 138),
                new ReportSymptom(31500, "fluttering in chest", "AF", 103),
            ],
            Distributions = Distributions(duration),
            Thresholds = new ReportThresholds(2.0, 3.0, 50, 60, 30),
            ToolVersion = "0.0.0-golden",
        };
    }

    private static RhythmDistributions Distributions(double duration)
    {
        var bins = (int)Math.Ceiling(duration / 60);
        var min = new float[bins];
        var mean = new float[bins];
        var max = new float[bins];
        for (var i = 0; i < bins; i++)
        {
            var night = i > 13 * 60 && i < 22 * 60;
            mean[i] = night ? 1050 : 800 + 60 * MathF.Sin(i / 90f);
            min[i] = mean[i] - 120;
            max[i] = mean[i] + 140;
        }

        var scatter = new int[90 * 90];
        for (var k = 15; k < 50; k++)
        {
            scatter[k * 90 + k] = 4000 - 80 * Math.Abs(k - 32) * 2;
            scatter[k * 90 + k + 1] = 300;
        }

        var histogram = new int[46];
        for (var k = 0; k < 46; k++)
        {
            histogram[k] = (int)(30000 * Math.Exp(-Math.Pow((k - 9) / 3.0, 2)));
        }

        return new RhythmDistributions
        {
            TachogramBinS = 60, RrMinMs = min, RrMeanMs = mean, RrMaxMs = max,
            ScatterMinMs = 200, ScatterStepMs = 20, ScatterBins = 90, ScatterCounts = scatter,
            HistogramMinBpm = 20, HistogramStepBpm = 5, HistogramCounts = histogram,
        };
    }
}
