namespace LongRecord.Reporting.Templates;

/// <summary>
/// Presentation only: which sections in what order, how many strips, paper size and header text. A template never
/// changes a figure (the analysis settings do that). Schema: <c>report-templates/README.md</c>.
/// </summary>
public sealed record ReportTemplate
{
    public const string OverviewSection = "overview", TrendsSection = "trends", EpisodesSection = "episodes",
        ThumbnailsSection = "thumbnails", StripsSection = "strips";

    public static readonly string[] KnownSections = [OverviewSection, TrendsSection, EpisodesSection, ThumbnailsSection, StripsSection];

    public required string Name { get; init; }

    public string Description { get; init; } = "";

    public PaperSize Paper { get; init; } = PaperSize.A4;

    /// <summary>Lines printed at the top of the first page (the service's name and address).</summary>
    public IReadOnlyList<string> Header { get; init; } = [];

    /// <summary>Sections in page order.</summary>
    public required IReadOnlyList<string> Sections { get; init; }

    /// <summary>At most this many episode thumbnails (flagged episodes in rank order; the table still lists all).</summary>
    public int ThumbnailStrips { get; init; } = 60;

    /// <summary>At most this many full-size episode strips (top-ranked flagged episodes).</summary>
    public int FullStrips { get; init; } = 8;

    /// <summary>Full-size strips also for the slowest and fastest rate, the longest pause and each patient event.</summary>
    public bool ReferenceStrips { get; init; } = true;

    /// <summary>At most this many patient-event strips (in time order), so a file with thousands of annotations stays a report.</summary>
    public int EventStrips { get; init; } = 50;

    /// <summary>At most this many rows in the episode table; the rest are counted in a closing line.</summary>
    public int EpisodeRows { get; init; } = 500;
}
