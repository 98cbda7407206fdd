using System.Reflection;
using System.Text;
using System.Text.Json;
using LongRecord.Analysis.Episodes;
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

    public static void Write(string path, RecordingDescription recording, RhythmResult rhythm, AnalysisSettings settings, EpisodeResult? episodes = null)
    {
        using var stream = File.Create(path);
        using var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true });
        w.WriteStartObject();
        foreach (var (key, value) in RhythmRows.Summary(rhythm))
        {
            WriteValue(w, key, value);
        }

        if (episodes is not null)
        {
            WriteEpisodes(w, episodes);
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

    // Counts by kind (all and flagged: at least one review reason) and the symptom-event table.
    private static void WriteEpisodes(Utf8JsonWriter w, EpisodeResult episodes)
    {
        foreach (var (key, value) in EpisodeRows.Summary(episodes))
        {
            WriteValue(w, key, value);
        }

        w.WriteStartObject("episodes_by_kind");
        foreach (var (kind, n) in episodes.CountsByKind())
        {
            w.WriteNumber(kind, n);
        }

        w.WriteEndObject();
        w.WriteStartObject("episodes_flagged_by_kind");
        foreach (var (kind, n) in episodes.FlaggedByKind())
        {
            w.WriteNumber(kind, n);
        }

        w.WriteEndObject();
        w.WriteStartArray("symptom_events");
        foreach (var e in episodes.SymptomEvents)
        {
            w.WriteStartObject();
            w.WriteNumber("time_s", Math.Round(e.TimeS, 3));
            w.WriteString("clock", e.ClockTime?.ToString("yyyy-MM-ddTHH:mm:ss", System.Globalization.CultureInfo.InvariantCulture));
            w.WriteString("text", e.Text);
            w.WriteString("source", e.Source);
            w.WriteString("rhythm", e.Rhythm);
            WriteValue(w, "mean_bpm", double.IsFinite(e.MeanBpm) ? Math.Round(e.MeanBpm, 1) : null);
            WriteValue(w, "min_bpm", double.IsFinite(e.MinBpm) ? Math.Round(e.MinBpm, 1) : null);
            WriteValue(w, "max_bpm", double.IsFinite(e.MaxBpm) ? Math.Round(e.MaxBpm, 1) : null);
            w.WriteStartArray("episode_ids");
            foreach (var id in e.EpisodeIds)
            {
                w.WriteNumberValue(id);
            }

            w.WriteEndArray();
            w.WriteEndObject();
        }

        w.WriteEndArray();
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
