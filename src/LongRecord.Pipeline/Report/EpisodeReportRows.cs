using System.Globalization;
using LongRecord.Analysis.Episodes;
using LongRecord.Reporting.Model;

namespace LongRecord.Pipeline.Report;

/// <summary>
/// The episodes stage's episodes as report rows, in the stage's own review order: kind, extent, rates, width,
/// regularity, flags, urgency and rank are copied, never re-decided; the evidence gains the onset, offset and atrial
/// findings in words. A group of similar episodes is one row (its representative) with the group's size.
/// </summary>
public static class EpisodeReportRows
{
    public static IReadOnlyList<ReportEpisode> Map(EpisodeResult episodes) =>
        episodes.Episodes
            .Where(e => e.Group == 0 || e.Group == e.Id)
            .OrderBy(e => e.Rank)
            .ThenBy(e => e.StartS)
            .Select(Row)
            .ToArray();

    private static ReportEpisode Row(Episode e) => new()
    {
        Kind = e.Kind,
        StartS = e.StartS,
        EndS = e.EndS,
        Beats = e.Beats,
        RateBpm = e.MeanBpm,
        MaxBpm = e.MaxBpm,
        QrsMs = e.QrsMs,
        QrsClass = e.Width switch { QrsWidth.Narrow => "narrow", QrsWidth.Broad => "broad", _ => "" },
        Regularity = e.Regularity,
        OnsetObserved = e.OnsetObserved,
        OffsetObserved = e.OffsetObserved,
        Evidence = Evidence(e),
        Flagged = e.Flagged,
        Urgent = e.Urgent,
        Rank = e.Rank,
    };

    private static string Evidence(Episode e)
    {
        var inv = CultureInfo.InvariantCulture;
        var parts = new List<string>();
        if (e.Evidence.Length > 0)
        {
            parts.Add(e.Evidence);
        }

        if (e.Onset is { } on && on.Type != "not-observed")
        {
            parts.Add(on.Trigger is "none" or "" ? $"onset {on.Type}" : $"onset {on.Type} after a {on.Trigger.Replace('-', ' ')} beat");
        }

        if (e.Offset is { } off && off.Termination != "not-observed")
        {
            parts.Add($"ended {off.Termination.Replace('-', ' ')}");
        }

        if (e.Atrial.Finding is not ("not-measured" or ""))
        {
            parts.Add(double.IsFinite(e.Atrial.AtrialRateBpm)
                ? string.Create(inv, $"atrial: {e.Atrial.Finding.Replace('-', ' ')}, {e.Atrial.AtrialRateBpm:0}/min")
                : $"atrial: {e.Atrial.Finding.Replace('-', ' ')}");
        }

        if (e.GroupSize > 1)
        {
            parts.Add(string.Create(inv, $"one of {e.GroupSize} similar episodes"));
        }

        parts.Add(string.Create(inv, $"confidence {e.Confidence:0.00}"));
        if (e.Reasons.Count > 0)
        {
            parts.Add("review: " + string.Join(", ", e.Reasons));
        }

        return string.Join("; ", parts);
    }
}
