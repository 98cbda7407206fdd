using LongRecord.Reporting.Model;

namespace LongRecord.Reporting.Strips;

/// <summary>A window of signal to draw, with its heading and markers.</summary>
public sealed record StripWindow(double StartS, double DurationS, IReadOnlyList<StripMarker> Markers);

/// <summary>A thumbnail of one flagged episode: its onset and end, or one window when the episode is short.</summary>
public sealed record Thumbnail(ReportEpisode Episode, IReadOnlyList<StripWindow> Panels);

/// <summary>A full-size strip: a heading that says why it is there, and its window.</summary>
public sealed record FullStrip(string Heading, string Detail, StripWindow Window);
