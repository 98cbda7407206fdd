using System.Globalization;
using System.Text.Json;

namespace LongRecord.Analysis.Settings;

/// <summary>
/// One named, range-checked number of a settings section: how to read it from JSON, write it back and check it.
/// Sections list their fields once in a table, so loading, validation and the written copy cannot drift apart.
/// </summary>
internal sealed class SettingField<T>(string name, Func<T, double> get, Func<T, double, T> set, double min, double max, bool whole = false, bool flag = false)
    where T : class
{
    /// <summary>A true/false setting, held as 1 or 0.</summary>
    public static SettingField<T> Flag(string name, Func<T, bool> get, Func<T, bool, T> set) =>
        new(name, s => get(s) ? 1 : 0, (s, v) => set(s, v != 0), 0, 1, whole: true, flag: true);

    public string Name { get; } = name;

    public double Get(T section) => get(section);

    public void Check(T section, string path, List<string> problems)
    {
        var v = get(section);
        if (!double.IsFinite(v) || v < min || v > max)
        {
            problems.Add($"{path}.{Name}: must be between {Text(min)} and {Text(max)} (is {Text(v)})");
        }
        else if (whole && v != Math.Floor(v))
        {
            problems.Add($"{path}.{Name}: must be a whole number (is {Text(v)})");
        }
    }

    public T Read(T section, JsonElement value, string path, List<string> problems)
    {
        if (flag)
        {
            if (value.ValueKind is JsonValueKind.True or JsonValueKind.False)
            {
                return set(section, value.GetBoolean() ? 1 : 0);
            }

            problems.Add($"{path}.{Name}: must be true or false");
            return section;
        }

        if (value.ValueKind != JsonValueKind.Number || !value.TryGetDouble(out var v))
        {
            problems.Add($"{path}.{Name}: must be a number");
            return section;
        }

        // Checked here as well as in Check: a whole-number field would otherwise truncate 2.5 to 2 unseen.
        if (whole && v != Math.Floor(v))
        {
            problems.Add($"{path}.{Name}: must be a whole number (is {Text(v)})");
            return section;
        }

        return set(section, v);
    }

    public void Write(T section, Utf8JsonWriter writer)
    {
        if (flag)
        {
            writer.WriteBoolean(Name, get(section) != 0);
        }
        else
        {
            writer.WriteNumber(Name, get(section));
        }
    }

    public static string Text(double v) => v.ToString("0.######", CultureInfo.InvariantCulture);
}

/// <summary>Reads, checks and writes one section through its field table.</summary>
internal static class SettingSection
{
    public static T Read<T>(T defaults, JsonElement element, string path, IReadOnlyList<SettingField<T>> fields, List<string> problems)
        where T : class
    {
        if (element.ValueKind != JsonValueKind.Object)
        {
            problems.Add($"{path}: must be a JSON object");
            return defaults;
        }

        var section = defaults;
        foreach (var property in element.EnumerateObject())
        {
            var field = Find(fields, property.Name);
            if (field is null)
            {
                problems.Add($"{path}.{property.Name}: is not a known setting");
                continue;
            }

            section = field.Read(section, property.Value, path, problems);
        }

        return section;
    }

    public static void Check<T>(T section, string path, IReadOnlyList<SettingField<T>> fields, List<string> problems)
        where T : class
    {
        foreach (var f in fields)
        {
            f.Check(section, path, problems);
        }
    }

    public static void Write<T>(T section, string name, IReadOnlyList<SettingField<T>> fields, Utf8JsonWriter writer)
        where T : class
    {
        writer.WriteStartObject(name);
        foreach (var f in fields)
        {
            f.Write(section, writer);
        }

        writer.WriteEndObject();
    }

    private static SettingField<T>? Find<T>(IReadOnlyList<SettingField<T>> fields, string name)
        where T : class
    {
        foreach (var f in fields)
        {
            if (f.Name == name)
            {
                return f;
            }
        }

        return null;
    }
}
