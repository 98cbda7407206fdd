namespace LongRecord.Formats.Csv;

/// <summary>How the time column of a CSV recording is written.</summary>
public enum CsvTimeFormat
{
    /// <summary>Seconds from the first sample, decimal point (column <c>time_s</c>).</summary>
    Seconds,

    /// <summary>ISO 8601 local date-time such as <c>2026-03-04T08:15:00.004</c> (column <c>time</c>).</summary>
    IsoDateTime,
}
