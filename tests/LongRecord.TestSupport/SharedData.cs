namespace LongRecord.TestSupport;

/// <summary>
/// Locates the open reference databases in <c>../shared/data</c> (read in place, never copied into the repository).
/// Search order: the <c>LONGRECORD_SHARED_DATA</c> environment variable; a <c>shared/data</c> folder beside any parent of
/// the test assembly's folder; <c>/work/shared/data</c>. A test that needs a missing file fails naming the path.
/// </summary>
public static class SharedData
{
    private static readonly Lazy<string?> s_root = new(FindRoot);

    /// <summary>The shared data folder, or null when none was found.</summary>
    public static string? Root => s_root.Value;

    /// <summary>Full path of <paramref name="relative"/> under the shared data folder; fails the test when it is missing.</summary>
    public static string Path(string relative)
    {
        var root = Root ?? throw new SharedDataMissingException(
            $"shared reference data not found: expected ../shared/data beside the repository (or set LONGRECORD_SHARED_DATA); needed {relative}");
        var full = System.IO.Path.Combine(root, relative);
        if (!File.Exists(full) && !Directory.Exists(full))
        {
            throw new SharedDataMissingException($"shared reference data missing: {full}");
        }

        return full;
    }

    /// <summary>Full path of a PhysioNet database folder, for example <c>Physionet("mitdb")</c>.</summary>
    public static string Physionet(string database) => Path(System.IO.Path.Combine("physionet", database));

    /// <summary>Record names listed in a database folder's RECORDS file, or the headers present when there is none.</summary>
    public static IReadOnlyList<string> Records(string database)
    {
        var folder = Physionet(database);
        var present = Directory.GetFiles(folder, "*.hea").Select(f => System.IO.Path.GetFileNameWithoutExtension(f)!).ToHashSet();
        var list = File.Exists(System.IO.Path.Combine(folder, "RECORDS"))
            ? File.ReadAllLines(System.IO.Path.Combine(folder, "RECORDS")).Select(l => l.Trim()).Where(l => l.Length > 0 && present.Contains(l))
            : present;
        return list.OrderBy(n => n, StringComparer.Ordinal).ToArray();
    }

    private static string? FindRoot()
    {
        var env = Environment.GetEnvironmentVariable("LONGRECORD_SHARED_DATA");
        if (!string.IsNullOrEmpty(env) && Directory.Exists(env))
        {
            return env;
        }

        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = System.IO.Path.Combine(dir.FullName, "shared", "data");
            if (Directory.Exists(candidate))
            {
                return candidate;
            }
        }

        return Directory.Exists("/work/shared/data") ? "/work/shared/data" : null;
    }
}

/// <summary>Raised when a test's reference data is not where <see cref="SharedData"/> looks.</summary>
public sealed class SharedDataMissingException(string message) : Exception(message);
