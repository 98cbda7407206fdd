namespace LongRecord.Formats.Csv;

/// <summary>A lead column to write: header cell <c>Label (Unit)</c>.</summary>
/// <param name="Label">Lead name; no separators, quotes or line breaks.</param>
/// <param name="Unit">A voltage unit (<c>mV</c>, <c>uV</c>, <c>µV</c>, <c>V</c>); samples are given to the writer in mV.</param>
public sealed record CsvLead(string Label, string Unit = "mV");
