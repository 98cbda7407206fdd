using System.Text;
using System.Text.Json;

namespace LongRecord.Analysis.Settings;

/// <summary>
/// Every analysis threshold in one object, in sections that later stages extend. Defaults are the values documented
/// on each member (with their source or "common practice, no source"). JSON form (camelCase, every key optional,
/// comments and trailing commas allowed):
/// <code>{ "rhythm": { "trendWindowS": 3600 }, "af": { "minEpisodeS": 30 }, "pauses": { "reportS": 2.0 } }</code>
/// </summary>
public sealed record AnalysisSettings
{
    public static AnalysisSettings Default { get; } = new();

    public RhythmSettings Rhythm { get; init; } = new();
    public HrvSettings Hrv { get; init; } = new();
    public IrregularitySettings Irregularity { get; init; } = new();
    public AfSettings Af { get; init; } = new();
    public PauseSettings Pauses { get; init; } = new();
    public BradycardiaSettings Bradycardia { get; init; } = new();
    public EpisodeSettings Episodes { get; init; } = new();

    /// <summary>
    /// Reads settings from JSON text; keys left out keep their defaults. Every problem (unknown key, wrong type, value
    /// out of range, inconsistent pair) is collected and thrown together in one <see cref="AnalysisSettingsException"/>.
    /// </summary>
    /// <param name="json">The settings text.</param>
    /// <param name="source">Name used in the error message, e.g. the file path.</param>
    public static AnalysisSettings Load(string json, string source = "settings")
    {
        JsonDocument doc;
        try
        {
            doc = JsonDocument.Parse(json, new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
        }
        catch (JsonException e)
        {
            throw new AnalysisSettingsException(source, [$"not valid JSON (line {e.LineNumber + 1}, position {e.BytePositionInLine + 1})"]);
        }

        var problems = new List<string>();
        var s = Default;
        using (doc)
        {
            if (doc.RootElement.ValueKind != JsonValueKind.Object)
            {
                throw new AnalysisSettingsException(source, ["the settings must be one JSON object"]);
            }

            foreach (var p in doc.RootElement.EnumerateObject())
            {
                s = p.Name switch
                {
                    "rhythm" => s with { Rhythm = SettingSection.Read(s.Rhythm, p.Value, p.Name, RhythmSettings.Fields, problems) },
                    "hrv" => s with { Hrv = SettingSection.Read(s.Hrv, p.Value, p.Name, HrvSettings.Fields, problems) },
                    "irregularity" => s with { Irregularity = SettingSection.Read(s.Irregularity, p.Value, p.Name, IrregularitySettings.Fields, problems) },
                    "af" => s with { Af = SettingSection.Read(s.Af, p.Value, p.Name, AfSettings.Fields, problems) },
                    "pauses" => s with { Pauses = SettingSection.Read(s.Pauses, p.Value, p.Name, PauseSettings.Fields, problems) },
                    "bradycardia" => s with { Bradycardia = SettingSection.Read(s.Bradycardia, p.Value, p.Name, BradycardiaSettings.Fields, problems) },
                    "episodes" => s with { Episodes = SettingSection.Read(s.Episodes, p.Value, p.Name, EpisodeSettings.Fields, problems) },
                    _ => Unknown(s, p.Name, problems),
                };
            }
        }

        problems.AddRange(s.Problems());
        return problems.Count == 0 ? s : throw new AnalysisSettingsException(source, problems);
    }

    /// <summary>Every problem of these settings (ranges and consistency), empty when they can be used.</summary>
    public IReadOnlyList<string> Problems()
    {
        var problems = new List<string>();
        SettingSection.Check(Rhythm, "rhythm", RhythmSettings.Fields, problems);
        SettingSection.Check(Hrv, "hrv", HrvSettings.Fields, problems);
        SettingSection.Check(Irregularity, "irregularity", IrregularitySettings.Fields, problems);
        SettingSection.Check(Af, "af", AfSettings.Fields, problems);
        SettingSection.Check(Pauses, "pauses", PauseSettings.Fields, problems);
        SettingSection.Check(Bradycardia, "bradycardia", BradycardiaSettings.Fields, problems);
        SettingSection.Check(Episodes, "episodes", EpisodeSettings.Fields, problems);
        Hrv.CheckBands(problems);
        if (Pauses.HighlightS < Pauses.ReportS)
        {
            problems.Add("pauses.highlightS: must be at least pauses.reportS");
        }

        if (Pauses.ReportS >= Rhythm.MaxBeatGapS)
        {
            problems.Add("pauses.reportS: must be below rhythm.maxBeatGapS");
        }

        if (Rhythm.TrendWindowS % Hrv.SegmentS != 0)
        {
            problems.Add("hrv.segmentS: must divide rhythm.trendWindowS exactly");
        }

        if (Irregularity.WindowBeats <= Irregularity.SampleEntropyM + 1)
        {
            problems.Add("irregularity.windowBeats: must exceed sampleEntropyM + 1");
        }

        return problems;
    }

    /// <summary>These settings, every key written, as indented JSON (for the summary of a run).</summary>
    public string ToJson()
    {
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true }))
        {
            WriteTo(w);
        }

        return Encoding.UTF8.GetString(stream.ToArray());
    }

    /// <summary>Writes these settings as one JSON object (the value, not a property name) to <paramref name="writer"/>.</summary>
    public void WriteTo(Utf8JsonWriter writer)
    {
        writer.WriteStartObject();
        SettingSection.Write(Rhythm, "rhythm", RhythmSettings.Fields, writer);
        SettingSection.Write(Hrv, "hrv", HrvSettings.Fields, writer);
        SettingSection.Write(Irregularity, "irregularity", IrregularitySettings.Fields, writer);
        SettingSection.Write(Af, "af", AfSettings.Fields, writer);
        SettingSection.Write(Pauses, "pauses", PauseSettings.Fields, writer);
        SettingSection.Write(Bradycardia, "bradycardia", BradycardiaSettings.Fields, writer);
        SettingSection.Write(Episodes, "episodes", EpisodeSettings.Fields, writer);
        writer.WriteEndObject();
    }

    private static AnalysisSettings Unknown(AnalysisSettings s, string name, List<string> problems)
    {
        problems.Add($"{name}: is not a known settings section (rhythm, hrv, irregularity, af, pauses, bradycardia, episodes)");
        return s;
    }
}
