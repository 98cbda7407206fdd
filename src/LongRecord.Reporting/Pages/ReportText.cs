using System.Globalization;

namespace LongRecord.Reporting.Pages;

/// <summary>How the report writes numbers and times: invariant culture, units always shown, "—" for no value.</summary>
public static class ReportText
{
    private static readonly CultureInfo s_inv = CultureInfo.InvariantCulture;

    public const string None = "—";

    public static string Number(double? v, int decimals) =>
        v is double d && double.IsFinite(d) ? d.ToString("F" + decimals, s_inv) : None;

    public static string Number(double? v, int decimals, string unit) =>
        v is double d && double.IsFinite(d) ? d.ToString("F" + decimals, s_inv) + " " + unit : None;

    public static string Count(int n) => n.ToString(s_inv);

    /// <summary>A duration: seconds below a minute, then h:mm:ss.</summary>
    public static string Duration(double? seconds)
    {
        if (seconds is not double s || !double.IsFinite(s))
        {
            return None;
        }

        if (s < 60)
        {
            return s.ToString("F1", s_inv) + " s";
        }

        var t = TimeSpan.FromSeconds(Math.Round(s));
        return $"{(int)t.TotalHours}:{t.Minutes:00}:{t.Seconds:00}";
    }

    /// <summary>
    /// The moment <paramref name="s"/> seconds after the first sample: clock time as recorded (with the day number
    /// from the start when the recording runs past one day), or elapsed time marked "+" when the file has no start.
    /// </summary>
    public static string Moment(DateTime? start, double s, bool seconds = true)
    {
        if (!double.IsFinite(s))
        {
            return None;
        }

        if (start is DateTime t0)
        {
            var t = t0.AddSeconds(s);
            var day = (t.Date - t0.Date).Days + 1;
            return $"d{day} {t.ToString(seconds ? "HH:mm:ss" : "HH:mm", s_inv)}";
        }

        var e = TimeSpan.FromSeconds(Math.Floor(s));
        return seconds ? $"+{(int)e.TotalHours}:{e.Minutes:00}:{e.Seconds:00}" : $"+{(int)e.TotalHours}:{e.Minutes:00}";
    }

    public static string Date(DateTime? d) => d?.ToString("yyyy-MM-dd HH:mm:ss", s_inv) ?? "not recorded";

    /// <summary>Words for an episode kind.</summary>
    public static string Kind(string kind) => kind switch
    {
        "af" => "AF",
        "af-brief" => "AF-like, brief",
        "pause" => "Pause",
        "bradycardia" => "Bradycardia",
        "svt" => "SVT",
        "sve-run" => "SVE run",
        "ve-run" => "VE run",
        "mat" => "Multifocal atrial tachycardia",
        "vf" => "Ventricular fibrillation (possible)",
        "sinus-with-pacs" => "Sinus rhythm with frequent PACs",
        "signal-loss" => "Signal lost on every lead",
        _ => kind.Length > 0 ? char.ToUpperInvariant(kind[0]) + kind[1..].Replace('-', ' ') : kind,
    };
}
