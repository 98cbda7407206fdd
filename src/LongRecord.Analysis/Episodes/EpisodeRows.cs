using System.Globalization;
using LongRecord.Analysis.Rhythm;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// Flat, invariant-culture rows of an <see cref="EpisodeResult"/> for <c>episodes.csv</c> and <c>summary.json</c>.
/// The first columns are a contract (<c>id,kind,start_s,end_s,duration_s,beats,mean_bpm,max_bpm</c>), then the
/// rhythm stage's columns, then the episode stage's: width, regularity, onset, offset, atrial finding, class evidence,
/// confidence and review.
/// </summary>
public static class EpisodeRows
{
    public static readonly string[] Columns =
    [
        "id", "kind", "start_s", "end_s", "duration_s", "beats", "mean_bpm", "max_bpm",
        "min_bpm", "onset_observed", "offset_observed", "highlighted", "context", "possible_av_block",
        "qrs_ms", "width", "regularity", "rr_cv", "run_class",
        "onset", "onset_ratio", "onset_trigger", "warm_up_s", "offset", "offset_ratio", "termination", "pause_after_s", "cool_down_s",
        "atrial_finding", "p_before_qrs_percent", "p_shapes", "p_vs_sinus", "atrial_rate_bpm",
        "confidence", "urgent", "flagged", "reasons", "rank", "group", "group_size",
        "onset_strip_start_s", "onset_strip_end_s", "offset_strip_start_s", "offset_strip_end_s", "evidence",
    ];

    public static IEnumerable<string[]> Rows(EpisodeResult result)
    {
        foreach (var e in result.Episodes)
        {
            var a = e.Atrial;
            yield return
            [
                Text(e.Id), e.Kind, Text(e.StartS, 3), Text(e.EndS, 3), Text(e.DurationS, 3), Text(e.Beats), Text(e.MeanBpm, 1), Text(e.MaxBpm, 1),
                Text(e.MinBpm, 1), Flag(e.OnsetObserved), Flag(e.OffsetObserved), Flag(e.Highlighted), RhythmRows.ContextWord(e.Context), Flag(e.PossibleAvBlock),
                Text(e.QrsMs, 0), WidthWord(e), e.Regularity, Text(e.RrCv, 3), e.RunClass,
                e.Onset?.Type ?? "", Text(e.Onset?.Ratio ?? double.NaN, 2), e.Onset?.Trigger ?? "", Text(e.Onset?.WarmUpS ?? double.NaN, 1),
                e.Offset?.Type ?? "", Text(e.Offset?.Ratio ?? double.NaN, 2), e.Offset?.Termination ?? "", Text(e.Offset?.PauseAfterS ?? double.NaN, 2), Text(e.Offset?.CoolDownS ?? double.NaN, 1),
                a.Finding == "not-measured" && e.Onset is null ? "" : a.Finding, Text(100 * a.PBeforeShare, 0), a.PShapes > 0 ? Text(a.PShapes) : "", Text(a.SinusPCorrelation, 2), Text(a.AtrialRateBpm, 0),
                Text(e.Confidence, 2), Flag(e.Urgent), Flag(e.Flagged), string.Join(';', e.Reasons), Text(e.Rank), Text(e.Group), Text(e.GroupSize),
                Text(e.OnsetStrip.StartS, 1), Text(e.OnsetStrip.EndS, 1), Text(e.OffsetStrip.StartS, 1), Text(e.OffsetStrip.EndS, 1), e.Evidence,
            ];
        }
    }

    /// <summary>summary.json values of the episode stage, snake_case keys.</summary>
    public static IReadOnlyList<KeyValuePair<string, object?>> Summary(EpisodeResult result) =>
    [
        new("episode_count", result.Episodes.Count),
        new("episode_flagged_count", result.Episodes.Count(e => e.Flagged)),
        new("episode_urgent_count", result.Episodes.Count(e => e.Urgent)),
        new("sve_couplet_count", result.SveCouplets),
        new("ve_couplet_count", result.VeCouplets),
        new("sve_run_3_5_count", result.Episodes.Count(e => e.Kind == EpisodeKinds.SveRun && e.RunClass == "run-3-5")),
        new("sve_run_6_plus_count", result.Episodes.Count(e => e.Kind == EpisodeKinds.SveRun && e.RunClass == "run-6+")),
        new("ve_run_3_5_count", result.Episodes.Count(e => e.Kind == EpisodeKinds.VeRun && e.RunClass == "run-3-5")),
        new("ve_run_6_plus_count", result.Episodes.Count(e => e.Kind == EpisodeKinds.VeRun && e.RunClass == "run-6+")),
    ];

    private static string WidthWord(Episode e) => e.Onset is null && e.Width == QrsWidth.Unknown ? "" : e.Width switch
    {
        QrsWidth.Narrow => "narrow",
        QrsWidth.Broad => "broad",
        _ => "unknown",
    };

    public static string Text(int v) => v.ToString(CultureInfo.InvariantCulture);

    public static string Text(double v, int decimals) => double.IsFinite(v) ? v.ToString("F" + decimals, CultureInfo.InvariantCulture) : "";

    private static string Flag(bool v) => v ? "1" : "0";
}
