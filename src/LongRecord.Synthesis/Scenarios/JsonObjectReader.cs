using System.Globalization;
using System.Text.Json;

namespace LongRecord.Synthesis.Scenarios;

/// <summary>
/// Reads the fields of one JSON object, recording every problem (with its path) instead of stopping at the first,
/// and reporting fields nobody asked for (typos) at the end.
/// </summary>
internal sealed class JsonObjectReader
{
    private readonly JsonElement _element;
    private readonly List<string> _errors;
    private readonly HashSet<string> _used = new(StringComparer.Ordinal);

    public JsonObjectReader(JsonElement element, string path, List<string> errors)
    {
        _element = element;
        Path = path;
        _errors = errors;
        IsObject = element.ValueKind == JsonValueKind.Object;
        if (!IsObject)
        {
            errors.Add($"{path}: must be a JSON object");
        }
    }

    public string Path { get; }

    public bool IsObject { get; }

    public string At(string field) => Path.Length == 0 ? field : $"{Path}.{field}";

    public void Error(string field, string problem) => _errors.Add($"{At(field)}: {problem}");

    public bool Has(string name) => IsObject && _element.TryGetProperty(name, out var v) && v.ValueKind != JsonValueKind.Null;

    public IEnumerable<string> PresentFields()
    {
        if (!IsObject)
        {
            yield break;
        }

        foreach (var p in _element.EnumerateObject())
        {
            yield return p.Name;
        }
    }

    public JsonElement? Raw(string name)
    {
        _used.Add(name);
        if (!IsObject || !_element.TryGetProperty(name, out var v) || v.ValueKind == JsonValueKind.Null)
        {
            return null;
        }

        return v;
    }

    public double? Number(string name, double min, double max, bool required = false)
    {
        var v = Raw(name);
        if (v is not JsonElement e)
        {
            if (required)
            {
                Error(name, "is required");
            }

            return null;
        }

        if (e.ValueKind != JsonValueKind.Number || !e.TryGetDouble(out var d) || !double.IsFinite(d))
        {
            Error(name, "must be a number");
            return null;
        }

        if (d < min || d > max)
        {
            Error(name, $"must be between {F(min)} and {F(max)} (is {F(d)})");
            return null;
        }

        return d;
    }

    public int? Integer(string name, int min, int max, bool required = false)
    {
        var d = Number(name, min, max, required);
        if (d is double value && value != Math.Floor(value))
        {
            Error(name, "must be a whole number");
            return null;
        }

        return d is double x ? (int)x : null;
    }

    public string? String(string name, bool required = false, IReadOnlyCollection<string>? allowed = null)
    {
        var v = Raw(name);
        if (v is not JsonElement e)
        {
            if (required)
            {
                Error(name, "is required");
            }

            return null;
        }

        if (e.ValueKind != JsonValueKind.String)
        {
            Error(name, "must be a string");
            return null;
        }

        var s = e.GetString()!;
        if (allowed is not null && !allowed.Contains(s))
        {
            Error(name, $"must be one of {string.Join(", ", allowed)} (is '{s}')");
            return null;
        }

        return s;
    }

    public bool? Bool(string name)
    {
        var v = Raw(name);
        if (v is not JsonElement e)
        {
            return null;
        }

        if (e.ValueKind is not (JsonValueKind.True or JsonValueKind.False))
        {
            Error(name, "must be true or false");
            return null;
        }

        return e.GetBoolean();
    }

    public IReadOnlyList<JsonElement>? Array(string name, bool required = false)
    {
        var v = Raw(name);
        if (v is not JsonElement e)
        {
            if (required)
            {
                Error(name, "is required");
            }

            return null;
        }

        if (e.ValueKind != JsonValueKind.Array)
        {
            Error(name, "must be an array");
            return null;
        }

        return e.EnumerateArray().ToArray();
    }

    public JsonObjectReader? Object(string name, string path)
    {
        var v = Raw(name);
        return v is JsonElement e ? new JsonObjectReader(e, path, _errors) : null;
    }

    public JsonObjectReader Child(JsonElement element, string path) => new(element, path, _errors);

    /// <summary>Reports every field present that no read asked for.</summary>
    public void RejectUnknown()
    {
        foreach (var name in PresentFields())
        {
            if (!_used.Contains(name))
            {
                Error(name, "is not a known field");
            }
        }
    }

    public static string F(double d) => d.ToString("0.###", CultureInfo.InvariantCulture);
}
