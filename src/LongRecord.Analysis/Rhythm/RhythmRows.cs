using System.Globalization;

namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// Flat, invariant-culture rows of a <see cref="RhythmResult"/> for the integrator's writers (episodes.csv,
/// hourly.csv, summary.json). Pure: builds strings and values, writes nothing. Numbers without a value are empty
/// cells (CSV) and null (summary).
/// </summary>
public static class RhythmRows
{
    /// <summary>episodes.csv header: begins exactly with id,kind,start_s,end_s,duration_s,beats,mean_bpm,max_bpm.</summary>
    public static readonly string[] EpisodeColumns =
        ["id", "kind", "start_s", "end_s", "duration_s", "beats", "mean_bpm", "max_bpm", "min_bpm", "onset_observed", "offset_observed", "highlighted", "context", "possible_av_block"];

    /// <summary>hourly.csv header.</summary>
    public static readonly string[] TrendColumns =
        ["hour", "clock_start", "start_s", "end_s", "analysable_min", "sufficient", "beats", "min_bpm", "mean_bpm", "max_bpm", "sve", "ve", "af_min", "af_burden_percent", "pauses", "sdnn_ms", "rmssd_ms"];

    /// <summary>One row per episode, ids 1, 2, … in time order.</summary>
    public static IEnumerable<string[]> Episodes(RhythmResult result)
    {
        var id = 0;
        foreach (var e in result.Episodes)
        {
            id++;
            yield return
            [
                Text(id), e.Kind, Text(e.StartS, 3), Text(e.EndS, 3), Text(e.DurationS, 3), Text(e.Beats), Text(e.MeanBpm, 1), Text(e.MaxBpm, 1),
                Text(e.MinBpm, 1), Flag(e.OnsetObserved), Flag(e.OffsetObserved), Flag(e.Highlighted), ContextWord(e.Context), Flag(e.PossibleAvBlock),
            ];
        }
    }

    public static IEnumerable<string[]> Trend(RhythmResult result)
    {
        foreach (var r in result.Trend)
        {
            yield return
            [
                Text(r.Index), r.ClockStart?.ToString("yyyy-MM-ddTHH:mm:ss", CultureInfo.InvariantCulture) ?? "", Text(r.StartS, 3), Text(r.EndS, 3),
                Text(r.AnalysableMinutes, 2), Flag(r.Sufficient), Text(r.Beats), Text(r.MinBpm, 1), Text(r.MeanBpm, 1), Text(r.MaxBpm, 1),
                Text(r.Sve), Text(r.Ve), Text(r.AfMinutes, 2), Text(r.AfBurdenPercent, 2), Text(r.Pauses), Text(r.SdnnMs, 1), Text(r.RmssdMs, 1),
            ];
        }
    }

    /// <summary>Summary values in order, snake_case keys; null for a value that does not exist.</summary>
    public static IReadOnlyList<KeyValuePair<string, object?>> Summary(RhythmResult result)
    {
        var s = result.Summary;
        var list = new List<KeyValuePair<string, object?>>
        {
            new("total_beats", s.TotalBeats),
            new("analysable_percent", Value(s.AnalysablePercent, 2)),
            new("hr_min_bpm", Value(s.HrMinBpm, 1)),
            new("hr_mean_bpm", Value(s.HrMeanBpm, 1)),
            new("hr_max_bpm", Value(s.HrMaxBpm, 1)),
            new("af_burden_percent", Value(s.AfBurdenPercent, 2)),
            new("pause_count", s.PauseCount),
        };
        foreach (var (c, n) in s.BeatsByClass)
        {
            list.Add(new($"beats_{c.ToString().ToLowerInvariant()}", n));
        }

        list.AddRange(
        [
            new("recording_s", Value(s.RecordingS, 3)),
            new("analysable_s", Value(s.AnalysableS, 3)),
            new("slowest_start_s", Value(s.Slowest?.StartS ?? double.NaN, 3)),
            new("fastest_start_s", Value(s.Fastest?.StartS ?? double.NaN, 3)),
            new("af_s", Value(s.AfS, 3)),
            new("af_episode_count", s.AfEpisodeCount),
            new("af_brief_count", s.AfBriefCount),
            new("af_longest_s", Value(s.LongestAfS, 3)),
            new("af_at_start", s.AfAtStart),
            new("af_at_end", s.AfAtEnd),
            new("pause_highlighted_count", s.HighlightedPauseCount),
            new("pause_longest_s", Value(s.LongestPauseS, 3)),
            new("bradycardia_count", s.BradycardiaCount),
            new("beat_gap_count", s.BeatGapCount),
            new("beat_gap_s", Value(s.BeatGapS, 3)),
            new("nn_count", s.Hrv.NnCount),
            new("sdnn_ms", Value(s.Hrv.SdnnMs, 1)),
            new("sdann_ms", Value(s.SdannMs, 1)),
            new("sdnn_index_ms", Value(s.SdnnIndexMs, 1)),
            new("rmssd_ms", Value(s.Hrv.RmssdMs, 1)),
            new("pnn50_percent", Value(s.Hrv.Pnn50Percent, 2)),
            new("hrv_triangular_index", Value(s.Hrv.TriangularIndex, 2)),
            new("lf_ms2", Value(s.LfMs2, 1)),
            new("hf_ms2", Value(s.HfMs2, 1)),
            new("lf_hf_ratio", Value(s.LfHfRatio, 3)),
            new("hrv_excluded_s", Value(s.HrvExcludedS, 3)),
            new("hrv_excluded_af_s", Value(s.HrvExcludedAfS, 3)),
        ]);
        foreach (var d in s.BurdenPerDay)
        {
            list.Add(new($"af_burden_day{d.Day}_percent", Value(d.BurdenPercent, 2)));
        }

        foreach (var f in s.AfDurationFacts)
        {
            list.Add(new($"af_longest_at_least_{Text(f.ThresholdH)}h", f.LongestReached));
        }

        return list;
    }

    public static string ContextWord(PauseContext c) => c switch
    {
        PauseContext.DuringAf => "during-af",
        PauseContext.AfterPremature => "after-premature",
        _ => "",
    };

    private static object? Value(double v, int decimals) => double.IsFinite(v) ? Math.Round(v, decimals) : null;

    private static string Text(int v) => v.ToString(CultureInfo.InvariantCulture);

    private static string Text(double v) => v.ToString("0.###", CultureInfo.InvariantCulture);

    private static string Text(double v, int decimals) => double.IsFinite(v) ? v.ToString("F" + decimals, CultureInfo.InvariantCulture) : "";

    private static string Flag(bool v) => v ? "1" : "0";
}
