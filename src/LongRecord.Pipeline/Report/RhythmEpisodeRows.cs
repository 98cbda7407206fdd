using System.Globalization;
using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Rhythm;
using LongRecord.Analysis.Settings;
using LongRecord.Reporting.Model;

namespace LongRecord.Pipeline.Report;

/// <summary>
/// Interim: the rhythm stage's episodes (af, af-brief, pause, bradycardia) as report rows, until the episodes stage
/// supplies its own ranked, flagged rows. Flagged: AF, highlighted pauses, bradycardia. Ranked: flagged first, then
/// pauses before AF before bradycardia before the rest, longer first. Nothing is marked urgent here: that is the
/// episodes stage's decision.
/// </summary>
public static class RhythmEpisodeRows
{
    /// <summary>QRS of at least this width is called broad: 120 ms, common practice, no source.</summary>
    public const double BroadQrsMs = 120;

    public static IReadOnlyList<ReportEpisode> Map(RhythmResult rhythm, IReadOnlyList<Beat> beats, double rateHz, AnalysisSettings settings)
    {
        var rows = rhythm.Episodes.Select(e => Row(e, beats, rateHz, settings)).ToList();
        var ordered = rows
            .OrderByDescending(r => r.Flagged)
            .ThenBy(r => KindOrder(r.Kind))
            .ThenByDescending(r => r.DurationS)
            .ThenBy(r => r.StartS)
            .ToList();
        return ordered.Select((r, i) => r with { Rank = i + 1 }).ToArray();
    }

    private static ReportEpisode Row(RhythmEpisode e, IReadOnlyList<Beat> beats, double rateHz, AnalysisSettings settings)
    {
        var isAf = e.Kind is RhythmEpisode.AfKind or RhythmEpisode.AfBriefKind;
        var qrs = e.Kind == RhythmEpisode.PauseKind ? double.NaN : MedianQrsMs(beats, rateHz, e.StartS, e.EndS);
        return new ReportEpisode
        {
            Kind = e.Kind,
            StartS = e.StartS,
            EndS = e.EndS,
            Beats = e.Beats,
            RateBpm = e.MeanBpm,
            MaxBpm = e.MaxBpm,
            QrsMs = qrs,
            QrsClass = double.IsFinite(qrs) ? qrs >= BroadQrsMs ? "broad" : "narrow" : "",
            Regularity = isAf ? "irregular" : "",
            OnsetObserved = e.OnsetObserved,
            OffsetObserved = e.OffsetObserved,
            Evidence = Evidence(e, settings),
            Flagged = e.Kind is RhythmEpisode.AfKind or RhythmEpisode.BradycardiaKind || (e.Kind == RhythmEpisode.PauseKind && e.Highlighted),
            Rank = 0,
        };
    }

    private static string Evidence(RhythmEpisode e, AnalysisSettings s)
    {
        var inv = CultureInfo.InvariantCulture;
        var seen = (e.OnsetObserved, e.OffsetObserved) switch
        {
            (false, false) => "; under way at both ends of the analysable stretch",
            (false, true) => "; already under way where the analysable stretch begins",
            (true, false) => "; still under way where the analysable stretch ends",
            _ => "",
        };
        return e.Kind switch
        {
            RhythmEpisode.AfKind => string.Create(inv, $"irregular RR with no consistent P waves for {Reporting.Pages.ReportText.Duration(e.DurationS)} (AF episodes from {s.Af.MinEpisodeS:0} s){seen}"),
            RhythmEpisode.AfBriefKind => string.Create(inv, $"AF-like irregular RR for {e.DurationS:0.#} s, shorter than {s.Af.MinEpisodeS:0} s: not counted in the AF burden{seen}"),
            RhythmEpisode.PauseKind => string.Create(inv, $"RR {e.DurationS:0.00} s (pauses from {s.Pauses.ReportS:0.0} s, flagged from {s.Pauses.HighlightS:0.0} s)") +
                (e.Context == PauseContext.DuringAf ? ", during AF" : e.Context == PauseContext.AfterPremature ? ", after a premature beat" : "") +
                (e.PossibleAvBlock ? ", a P wave with no QRS inside: possible AV block" : "") + seen,
            RhythmEpisode.BradycardiaKind => string.Create(inv, $"8-beat average rate below {s.Bradycardia.RateBpm:0} bpm for {Reporting.Pages.ReportText.Duration(e.DurationS)} (from {s.Bradycardia.MinDurationS:0} s), lowest {e.MinBpm:0} bpm{seen}"),
            _ => e.Kind + seen,
        };
    }

    private static int KindOrder(string kind) => kind switch
    {
        RhythmEpisode.PauseKind => 0,
        RhythmEpisode.AfKind => 1,
        RhythmEpisode.BradycardiaKind => 2,
        _ => 3,
    };

    // Median measured QRS width of the episode's beats; NaN when none was measured.
    private static double MedianQrsMs(IReadOnlyList<Beat> beats, double rateHz, double startS, double endS)
    {
        var from = (long)Math.Floor(startS * rateHz);
        var to = (long)Math.Ceiling(endS * rateHz);
        var lo = BeatSearch.FirstAtOrAfter(beats, from);
        var widths = new List<float>();
        for (var i = lo; i < beats.Count && beats[i].Sample <= to; i++)
        {
            if (float.IsFinite(beats[i].QrsMs))
            {
                widths.Add(beats[i].QrsMs);
            }
        }

        if (widths.Count == 0)
        {
            return double.NaN;
        }

        widths.Sort();
        var m = widths.Count / 2;
        return widths.Count % 2 == 1 ? widths[m] : (widths[m - 1] + widths[m]) / 2.0;
    }
}
