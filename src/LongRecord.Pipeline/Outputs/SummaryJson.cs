using System.Reflection;
using System.Text;
using System.Text.Json;
using LongRecord.Analysis.Rhythm;
using LongRecord.Analysis.Settings;

namespace LongRecord.Pipeline.Outputs;

/// <summary>
/// <c>summary.json</c>: the whole-recording figures (units in every key's name: <c>_bpm</c>, <c>_percent</c>, <c>_s</c>,
/// <c>_ms</c>), what was analysed and how, the analysis settings used and the tool version. The top-level keys
/// <c>total_beats</c>, <c>analysable_percent</c>, <c>hr_min_bpm</c>, <c>hr_mean_bpm</c>, <c>hr_max_bpm</c>,
/// <c>af_burden_percent</c> and <c>pause_count</c> are a contract.
/// </summary>
public static class SummaryJson
{
    public const int SchemaVersion = 1;

    public static string ToolVersion { get; } =
        typeof(SummaryJson).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion.Split('+')[0] ?? "0";

    public static void Write(string path, RecordingDescription recording, RhythmResult rhythm, AnalysisSettings settings)
    {
        using var stream = File.Create(path);
        using var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true });
        w.WriteStartObject();
        foreach (var (key, value) in RhythmRows.Summary(rhythm))
        {
            WriteValue(w, key, value);
        }

        w.WriteString("tool", "LongRecord");
        w.WriteString("tool_version", ToolVersion);
        w.WriteNumber("schema_version", SchemaVersion);
        w.WriteStartObject("recording");
        w.WriteString("name", recording.Name);
        w.WriteString("format", recording.Format);
        w.WriteString("start", recording.Start?.ToString("yyyy-MM-ddTHH:mm:ss", System.Globalization.CultureInfo.InvariantCulture));
        w.WriteString("times", recording.Start is null ? "elapsed from the first sample (no start time in the file)" : "as recorded (device local time)");
        w.WriteNumber("duration_s", Math.Round(recording.DurationS, 3));
        w.WriteNumber("f_ref_hz", recording.ReferenceRateHz);
        w.WriteStartArray("leads");
        foreach (var l in recording.Leads)
        {
            w.WriteStringValue(l);
        }

        w.WriteEndArray();
        w.WriteString("beat_source", recording.BeatSource);
        w.WriteBoolean("signal_analysed", recording.SignalAnalysed);
        if (!recording.SignalAnalysed)
        {
            w.WriteString("note", "beats taken from annotations with no signal: QRS widths, P waves, lead quality and strips are not available");
        }

        w.WriteEndObject();
        w.WritePropertyName("settings");
        settings.WriteTo(w);
        w.WriteEndObject();
    }

    private static void WriteValue(Utf8JsonWriter w, string key, object? value)
    {
        switch (value)
        {
            case null:
                w.WriteNull(key);
                break;
            case bool b:
                w.WriteBoolean(key, b);
                break;
            case int i:
                w.WriteNumber(key, i);
                break;
            case long l:
                w.WriteNumber(key, l);
                break;
            case double d:
                w.WriteNumber(key, d);
                break;
            case string s:
                w.WriteString(key, s);
                break;
            default:
                w.WriteString(key, Convert.ToString(value, System.Globalization.CultureInfo.InvariantCulture));
                break;
        }
    }
}

/// <summary>What summary.json says about the recording itself.</summary>
public sealed record RecordingDescription(string Name, string Format, DateTime? Start, double DurationS, double ReferenceRateHz, IReadOnlyList<string> Leads, string BeatSource, bool SignalAnalysed);
