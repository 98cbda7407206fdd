namespace LongRecord.Reporting.Pages;

/// <summary>One section of the report: knows how many pages it needs before any is drawn (for "page n of N").</summary>
public interface IReportSection
{
    /// <summary>Running title printed at the top of its pages.</summary>
    string Title { get; }

    int PageCount(ReportContext context);

    void DrawPage(ReportContext context, int page);
}
