using System.Globalization;

namespace LongRecord.Reporting.Pages;

/// <summary>
/// The trend pages' horizontal axis: the whole recording, ticks on round clock times as recorded (or round elapsed
/// times when the file has no start time), from 5 min to 2 days apart so that at most about a dozen are labelled.
/// </summary>
public sealed class TimeAxis(DateTime? start, double durationS, float leftMm, float widthMm)
{
    private static readonly int[] s_stepsS = [300, 600, 900, 1800, 3600, 7200, 10800, 14400, 21600, 43200, 86400, 172800];

    public float Left { get; } = leftMm;

    public float Width { get; } = widthMm;

    public float Right => Left + Width;

    public double DurationS { get; } = Math.Max(durationS, 1);

    public float X(double s) => Left + (float)(Math.Clamp(s, 0, DurationS) / DurationS * Width);

    /// <summary>Tick positions (seconds from the first sample) and their labels.</summary>
    public IReadOnlyList<(double S, string Label)> Ticks()
    {
        var step = s_stepsS.FirstOrDefault(h => DurationS / h <= 12, 345600);
        var ticks = new List<(double, string)>();
        if (start is DateTime t0)
        {
            // First clock time at or after the start that is a multiple of the step counted from midnight.
            var first = t0.Date.AddSeconds(Math.Ceiling((t0 - t0.Date).TotalSeconds / step) * step);
            for (var t = first; (t - t0).TotalSeconds <= DurationS; t = t.AddSeconds(step))
            {
                var s = (t - t0).TotalSeconds;
                var label = t.Hour == 0 ? $"d{(t.Date - t0.Date).Days + 1} 00:00" : t.ToString("HH:mm", CultureInfo.InvariantCulture);
                ticks.Add((s, label));
            }
        }
        else
        {
            for (var e = 0; e <= DurationS; e += step)
            {
                ticks.Add((e, step % 3600 == 0 ? $"+{e / 3600} h" : $"+{e / 3600}:{e % 3600 / 60:00}"));
            }
        }

        return ticks;
    }

    /// <summary>Words under the axis saying what its times are.</summary>
    public string Caption => start is null ? "elapsed time from the first sample (no start time in the file)" : "clock time as recorded (device local time)";
}
