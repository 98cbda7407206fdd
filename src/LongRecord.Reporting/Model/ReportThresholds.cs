namespace LongRecord.Reporting.Model;

/// <summary>The analysis thresholds the report names beside its counts (from the settings the analysis used).</summary>
public sealed record ReportThresholds(double PauseReportS, double PauseHighlightS, double BradycardiaBpm, double BradycardiaMinS, double AfMinEpisodeS);
