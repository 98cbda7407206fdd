namespace LongRecord.Analysis.Episodes;

/// <summary>Everything the episode stage found.</summary>
public sealed record EpisodeResult
{
    public static EpisodeResult Empty { get; } = new() { Episodes = [], SymptomEvents = [] };

    /// <summary>Episodes in time order, ids 1, 2, ….</summary>
    public required IReadOnlyList<Episode> Episodes { get; init; }

    /// <summary>The symptom-event table, in time order.</summary>
    public required IReadOnlyList<SymptomEvent> SymptomEvents { get; init; }

    /// <summary>SVE couplets (two consecutive S beats; EC57 run class "couplet").</summary>
    public int SveCouplets { get; init; }

    /// <summary>VE couplets (two consecutive V beats).</summary>
    public int VeCouplets { get; init; }

    /// <summary>False when the episodes were found without a signal (no widths, no atrial activity).</summary>
    public bool SignalAnalysed { get; init; }

    /// <summary>Episodes per kind, every kind listed (zero included), in <see cref="EpisodeKinds.All"/> order.</summary>
    public IReadOnlyList<KeyValuePair<string, int>> CountsByKind() => Count(_ => true);

    /// <summary>Flagged episodes (at least one review reason) per kind.</summary>
    public IReadOnlyList<KeyValuePair<string, int>> FlaggedByKind() => Count(e => e.Flagged);

    private List<KeyValuePair<string, int>> Count(Func<Episode, bool> take)
    {
        var list = new List<KeyValuePair<string, int>>();
        foreach (var kind in EpisodeKinds.All)
        {
            var n = 0;
            foreach (var e in Episodes)
            {
                n += e.Kind == kind && take(e) ? 1 : 0;
            }

            list.Add(new(kind, n));
        }

        return list;
    }
}
