using System.Globalization;
using LongRecord.Analysis.Episodes;
using LongRecord.Analysis.Rhythm;
using LongRecord.Pipeline.Outputs;
using LongRecord.Reporting.Model;

namespace LongRecord.Pipeline.Report;

/// <summary>
/// Builds the report's model from the analysis result that summary.json is written from. Whole-recording figures are
/// read from the very rows summary.json writes (<see cref="RhythmRows.Summary"/>), so the PDF and the JSON cannot
/// disagree; what summary.json does not hold (plot series, per-hour shares, the rhythm at each patient event) is
/// derived here from the same beats and trend rows.
/// </summary>
public static class ReportModelMapper
{
    public static ReportModel Build(RecordingAnalysis a, string recordingName, ReportPatient patient)
    {
        var r = a.Rhythm;
        var episodes = EpisodeReportRows.Map(a.Episodes);
        return new ReportModel
        {
            Patient = patient,
            Recording = new ReportRecording(recordingName, a.Info.FormatDetail, a.Info.StartDateTime, a.DurationS, a.ReferenceRateHz, a.LeadLabels, a.BeatSource, a.Info.HasSignal),
            Figures = Figures(r) with { EctopicRuns = EctopicRuns(a.Episodes) },
            Hours = r.Trend.Select(Hour).ToArray(),
            Episodes = episodes,
            EpisodeCounts = a.Episodes.CountsByKind(),
            FlaggedEpisodeCount = FlaggedCount(a.Episodes),
            Symptoms = a.Episodes.SymptomEvents.Select(Symptom).ToArray(),
            Distributions = DistributionsBuilder.Build(a.Beats, a.ReferenceRateHz, a.DurationS, a.Settings.Rhythm.MaxBeatGapS),
            Thresholds = new ReportThresholds(a.Settings.Pauses.ReportS, a.Settings.Pauses.HighlightS, a.Settings.Bradycardia.RateBpm, a.Settings.Bradycardia.MinDurationS, a.Settings.Af.MinEpisodeS),
            ToolVersion = SummaryJson.ToolVersion,
        };
    }

    // The ectopic couplets and runs exactly as summary.json holds them (EC57 run classes).
    private static IReadOnlyList<KeyValuePair<string, int>> EctopicRuns(EpisodeResult e)
    {
        var d = EpisodeRows.Summary(e).ToDictionary(kv => kv.Key, kv => kv.Value);
        KeyValuePair<string, int> Row(string words, string key) => new(words, Convert.ToInt32(d[key], CultureInfo.InvariantCulture));
        return
        [
            Row("SVE couplets", "sve_couplet_count"),
            Row("SVE runs of 3–5", "sve_run_3_5_count"),
            Row("SVE runs of ≥ 6", "sve_run_6_plus_count"),
            Row("VE couplets", "ve_couplet_count"),
            Row("VE runs of 3–5", "ve_run_3_5_count"),
            Row("VE runs of ≥ 6", "ve_run_6_plus_count"),
        ];
    }

    // The flagged-episode count exactly as summary.json holds it.
    private static int FlaggedCount(EpisodeResult e) =>
        Convert.ToInt32(EpisodeRows.Summary(e).First(kv => kv.Key == "episode_flagged_count").Value, CultureInfo.InvariantCulture);

    /// <summary>The figures exactly as summary.json holds them.</summary>
    public static ReportFigures Figures(RhythmResult r)
    {
        var d = RhythmRows.Summary(r).ToDictionary(kv => kv.Key, kv => kv.Value);
        double? N(string key) => d.TryGetValue(key, out var v) && v is not null ? Convert.ToDouble(v, CultureInfo.InvariantCulture) : null;
        int I(string key) => Convert.ToInt32(d[key], CultureInfo.InvariantCulture);
        bool B(string key) => d[key] is true;
        var s = r.Summary;
        return new ReportFigures
        {
            TotalBeats = I("total_beats"),
            AnalysablePercent = N("analysable_percent"),
            AnalysableS = N("analysable_s"),
            RecordingS = N("recording_s"),
            HrMinBpm = N("hr_min_bpm"),
            HrMeanBpm = N("hr_mean_bpm"),
            HrMaxBpm = N("hr_max_bpm"),
            Slowest = s.Slowest is { } slow ? new ReportPeriod(slow.StartS, slow.EndS, N("hr_min_bpm") ?? slow.Bpm) : null,
            Fastest = s.Fastest is { } fast ? new ReportPeriod(fast.StartS, fast.EndS, N("hr_max_bpm") ?? fast.Bpm) : null,
            AfBurdenPercent = N("af_burden_percent"),
            AfEpisodeCount = I("af_episode_count"),
            AfBriefCount = I("af_brief_count"),
            AfLongestS = N("af_longest_s"),
            AfAtStart = B("af_at_start"),
            AfAtEnd = B("af_at_end"),
            AfBurdenPerDayPercent = s.BurdenPerDay.Select(day => N($"af_burden_day{day.Day}_percent")).ToArray(),
            PauseCount = I("pause_count"),
            PauseHighlightedCount = I("pause_highlighted_count"),
            PauseLongestS = N("pause_longest_s"),
            BradycardiaCount = I("bradycardia_count"),
            BeatsByClass = s.BeatsByClass.Keys.Select(c => new KeyValuePair<string, int>(c.ToString(), I($"beats_{c.ToString().ToLowerInvariant()}"))).ToArray(),
            SdnnMs = N("sdnn_ms"),
            SdannMs = N("sdann_ms"),
            SdnnIndexMs = N("sdnn_index_ms"),
            RmssdMs = N("rmssd_ms"),
            Pnn50Percent = N("pnn50_percent"),
            HrvTriangularIndex = N("hrv_triangular_index"),
            LfMs2 = N("lf_ms2"),
            HfMs2 = N("hf_ms2"),
            LfHfRatio = N("lf_hf_ratio"),
            HrvExcludedS = N("hrv_excluded_s"),
        };
    }

    private static ReportHour Hour(TrendRow t) => new()
    {
        StartS = t.StartS,
        EndS = t.EndS,
        ClockStart = t.ClockStart,
        AnalysablePercent = t.EndS > t.StartS ? Math.Min(100, 100 * t.AnalysableMinutes * 60 / (t.EndS - t.StartS)) : 0,
        Sufficient = t.Sufficient,
        MinBpm = t.MinBpm,
        MeanBpm = t.MeanBpm,
        MaxBpm = t.MaxBpm,
        AfBurdenPercent = t.AfBurdenPercent,
        Sve = t.Sve,
        Ve = t.Ve,
        Pauses = t.Pauses,
    };

    // The episodes stage's symptom table, in words: the kinds found around the event and the mean rate there.
    private static ReportSymptom Symptom(SymptomEvent e)
    {
        var rhythm = e.Rhythm switch
        {
            "no-episode" => "no episode found",
            "no-beats" => "no analysable beats",
            _ => string.Join(", ", e.Rhythm.Split('+').Select(Reporting.Pages.ReportText.Kind)),
        };
        return new ReportSymptom(e.TimeS, e.Text, rhythm, e.MeanBpm);
    }
}
