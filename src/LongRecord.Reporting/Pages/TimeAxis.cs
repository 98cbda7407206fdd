using System.Globalization;

namespace LongRecord.Reporting.Pages;

/// <summary>
/// The trend pages' horizontal axis: the whole recording, ticks on whole clock hours as recorded (or elapsed hours
/// when the file has no start time), spaced so that at most about a dozen are labelled.
/// </summary>
public sealed class TimeAxis(DateTime? start, double durationS, float leftMm, float widthMm)
{
    private static readonly int[] s_stepsH = [1, 2, 3, 4, 6, 12, 24, 48];

    public float Left { get; } = leftMm;

    public float Width { get; } = widthMm;

    public float Right => Left + Width;

    public double DurationS { get; } = Math.Max(durationS, 1);

    public float X(double s) => Left + (float)(Math.Clamp(s, 0, DurationS) / DurationS * Width);

    /// <summary>Tick positions (seconds from the first sample) and their labels.</summary>
    public IReadOnlyList<(double S, string Label)> Ticks()
    {
        var hours = DurationS / 3600;
        var step = s_stepsH.FirstOrDefault(h => hours / h <= 12, 96);
        var ticks = new List<(double, string)>();
        if (start is DateTime t0)
        {
            // First whole hour at or after the start that is a multiple of the step in clock time.
            var first = t0.Date.AddHours(Math.Ceiling((t0 - t0.Date).TotalHours / step) * step);
            for (var t = first; (t - t0).TotalSeconds <= DurationS; t = t.AddHours(step))
            {
                var s = (t - t0).TotalSeconds;
                var label = t.Hour == 0 ? $"d{(t.Date - t0.Date).Days + 1} 00:00" : t.ToString("HH:mm", CultureInfo.InvariantCulture);
                ticks.Add((s, label));
            }
        }
        else
        {
            for (var h = 0; h * 3600.0 <= DurationS; h += step)
            {
                ticks.Add((h * 3600.0, $"+{h} h"));
            }
        }

        return ticks;
    }

    /// <summary>Words under the axis saying what its times are.</summary>
    public string Caption => start is null ? "elapsed time from the first sample (no start time in the file)" : "clock time as recorded (device local time)";
}
