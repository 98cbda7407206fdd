using System.Text.Json;

namespace LongRecord.Reporting.Templates;

/// <summary>
/// Reads a report template: a built-in name (<c>standard</c>, <c>brief</c>, shipped from <c>report-templates/</c>)
/// or a JSON file. Every problem is listed at once; unknown keys are problems (a misspelt key must not be ignored).
/// </summary>
public static class TemplateLoader
{
    private const string ResourcePrefix = "report-templates/";

    private static readonly string[] s_keys = ["$schema", "schema", "name", "description", "paper", "header", "sections", "thumbnailStrips", "fullStrips", "referenceStrips", "eventStrips", "episodeRows"];

    /// <summary>Names of the built-in templates.</summary>
    public static IReadOnlyList<string> BuiltInNames { get; } = typeof(TemplateLoader).Assembly.GetManifestResourceNames()
        .Where(n => n.StartsWith(ResourcePrefix, StringComparison.Ordinal) && n.EndsWith(".json", StringComparison.Ordinal))
        .Select(n => n[ResourcePrefix.Length..^".json".Length])
        .Order(StringComparer.Ordinal)
        .ToArray();

    public static ReportTemplate Standard => Load("standard");

    /// <summary>A built-in template's name, or a path to a JSON file.</summary>
    public static ReportTemplate Load(string nameOrPath)
    {
        if (BuiltInNames.Contains(nameOrPath))
        {
            using var stream = typeof(TemplateLoader).Assembly.GetManifestResourceStream($"{ResourcePrefix}{nameOrPath}.json")!;
            using var text = new StreamReader(stream);
            return Parse(text.ReadToEnd(), $"template {nameOrPath}");
        }

        if (!File.Exists(nameOrPath))
        {
            throw new ReportTemplateException(nameOrPath, [$"no such template file, and not a built-in template ({string.Join(", ", BuiltInNames)})"]);
        }

        return Parse(File.ReadAllText(nameOrPath), nameOrPath);
    }

    public static ReportTemplate Parse(string json, string source)
    {
        JsonDocument doc;
        try
        {
            doc = JsonDocument.Parse(json, new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
        }
        catch (JsonException e)
        {
            throw new ReportTemplateException(source, [$"not valid JSON: {e.Message}"]);
        }

        using (doc)
        {
            return Read(doc.RootElement, source);
        }
    }

    private static ReportTemplate Read(JsonElement root, string source)
    {
        var problems = new List<string>();
        if (root.ValueKind != JsonValueKind.Object)
        {
            throw new ReportTemplateException(source, ["the template must be a JSON object"]);
        }

        foreach (var p in root.EnumerateObject())
        {
            if (!s_keys.Contains(p.Name))
            {
                problems.Add($"unknown key \"{p.Name}\" (known: {string.Join(", ", s_keys.Skip(2))})");
            }
        }

        var name = String(root, "name", problems) ?? "";
        if (name.Length == 0)
        {
            problems.Add("\"name\" is required");
        }

        var paper = PaperSize.A4;
        if (String(root, "paper", problems) is string paperName)
        {
            paper = PaperSize.FromName(paperName) ?? paper;
            if (PaperSize.FromName(paperName) is null)
            {
                problems.Add($"\"paper\" must be A4 or Letter (is \"{paperName}\")");
            }
        }

        var sections = Strings(root, "sections", problems);
        if (sections is null || sections.Count == 0)
        {
            problems.Add("\"sections\" must list at least one of " + string.Join(", ", ReportTemplate.KnownSections));
        }
        else
        {
            foreach (var s in sections.Where(s => !ReportTemplate.KnownSections.Contains(s)))
            {
                problems.Add($"unknown section \"{s}\" (known: {string.Join(", ", ReportTemplate.KnownSections)})");
            }

            foreach (var s in sections.GroupBy(s => s).Where(g => g.Count() > 1))
            {
                problems.Add($"section \"{s.Key}\" is listed twice");
            }
        }

        var template = new ReportTemplate
        {
            Name = name,
            Description = String(root, "description", problems) ?? "",
            Paper = paper,
            Header = Strings(root, "header", problems) ?? [],
            Sections = sections ?? [],
            ThumbnailStrips = Count(root, "thumbnailStrips", 60, 500, problems),
            FullStrips = Count(root, "fullStrips", 8, 200, problems),
            ReferenceStrips = Bool(root, "referenceStrips", true, problems),
            EventStrips = Count(root, "eventStrips", 50, 500, problems),
            EpisodeRows = Count(root, "episodeRows", 500, 100_000, problems),
        };
        if (template.Header.Count > 4)
        {
            problems.Add($"\"header\" holds at most 4 lines (has {template.Header.Count})");
        }

        if (problems.Count > 0)
        {
            throw new ReportTemplateException(source, problems);
        }

        return template;
    }

    private static string? String(JsonElement root, string key, List<string> problems)
    {
        if (!root.TryGetProperty(key, out var v))
        {
            return null;
        }

        if (v.ValueKind != JsonValueKind.String)
        {
            problems.Add($"\"{key}\" must be a string");
            return null;
        }

        return v.GetString();
    }

    private static List<string>? Strings(JsonElement root, string key, List<string> problems)
    {
        if (!root.TryGetProperty(key, out var v))
        {
            return null;
        }

        if (v.ValueKind != JsonValueKind.Array || v.EnumerateArray().Any(e => e.ValueKind != JsonValueKind.String))
        {
            problems.Add($"\"{key}\" must be an array of strings");
            return null;
        }

        return v.EnumerateArray().Select(e => e.GetString()!).ToList();
    }

    private static int Count(JsonElement root, string key, int fallback, int max, List<string> problems)
    {
        if (!root.TryGetProperty(key, out var v))
        {
            return fallback;
        }

        if (v.ValueKind != JsonValueKind.Number || !v.TryGetInt32(out var n) || n < 0 || n > max)
        {
            problems.Add($"\"{key}\" must be a whole number from 0 to {max}");
            return fallback;
        }

        return n;
    }

    private static bool Bool(JsonElement root, string key, bool fallback, List<string> problems)
    {
        if (!root.TryGetProperty(key, out var v))
        {
            return fallback;
        }

        if (v.ValueKind is not (JsonValueKind.True or JsonValueKind.False))
        {
            problems.Add($"\"{key}\" must be true or false");
            return fallback;
        }

        return v.GetBoolean();
    }
}
