using System.Security.Cryptography;
using System.Text;
using LongRecord.Formats;

namespace LongRecord.Pipeline.Inputs;

/// <summary>
/// Turns the command line's files and folders into the sorted list of recordings: a folder means every recording under
/// it (WFDB records by their headers; EDF, BDF, ISHNE and CSV files by content). Output folder names are decided on the
/// whole sorted list, so the same input always lands in the same folder.
/// </summary>
public static class RecordingDiscovery
{
    // Files that belong to a WFDB record but are not its header, and other files never opened as recordings.
    // (".ecg" is both a WFDB annotator and the usual ISHNE extension: content decides.)
    private static readonly HashSet<string> s_sideExtensions = new(StringComparer.OrdinalIgnoreCase)
    {
        ".dat", ".atr", ".qrs", ".q1c", ".q2c", ".man", ".pu", ".pu0", ".pu1", ".xws", ".beats", ".json", ".md", ".htm", ".html", ".pdf", ".png",
    };

    public static IReadOnlyList<RecordingInput> Find(IEnumerable<string> inputs)
    {
        var found = new List<(string Path, string Relative)>();
        foreach (var input in inputs)
        {
            if (Directory.Exists(input))
            {
                var root = System.IO.Path.GetFullPath(input);
                foreach (var file in Directory.EnumerateFiles(root, "*", SearchOption.AllDirectories).Order(StringComparer.Ordinal))
                {
                    if (IsCandidate(file))
                    {
                        found.Add((file, System.IO.Path.GetRelativePath(root, file)));
                    }
                }
            }
            else
            {
                // A file named directly is always attempted, so a bad one gets its own error line.
                found.Add((input, System.IO.Path.GetFileName(input)));
            }
        }

        var sorted = found.DistinctBy(f => System.IO.Path.GetFullPath(f.Path)).OrderBy(f => f.Relative, StringComparer.Ordinal).ThenBy(f => f.Path, StringComparer.Ordinal).ToList();
        var names = sorted.Select(f => NameOf(f.Path)).ToList();
        var collide = names.GroupBy(n => n, StringComparer.OrdinalIgnoreCase).Where(g => g.Count() > 1).Select(g => g.Key).ToHashSet(StringComparer.OrdinalIgnoreCase);
        return sorted.Select((f, i) => new RecordingInput(f.Path, f.Relative, names[i], collide.Contains(names[i]) ? $"{names[i]}-{ShortHash(f.Relative)}" : names[i])).ToArray();
    }

    /// <summary>The recording's name: the WFDB record name, or the file name without its extension.</summary>
    public static string NameOf(string path) => System.IO.Path.GetFileNameWithoutExtension(path);

    /// <summary>First 8 hex digits of SHA-256 of the relative path (with '/' separators).</summary>
    public static string ShortHash(string relativePath) =>
        Convert.ToHexString(SHA256.HashData(Encoding.UTF8.GetBytes(relativePath.Replace('\\', '/'))))[..8].ToLowerInvariant();

    // Extensions that say "recording": such a file is always attempted, so a damaged one gets its own error line.
    private static readonly HashSet<string> s_recordingExtensions = new(StringComparer.OrdinalIgnoreCase)
    {
        ".hea", ".edf", ".bdf", ".rec", ".ishne", ".csv",
    };

    private static bool IsCandidate(string file)
    {
        var ext = System.IO.Path.GetExtension(file);
        if (s_recordingExtensions.Contains(ext))
        {
            return true;
        }

        if (s_sideExtensions.Contains(ext) || System.IO.Path.GetFileName(file).StartsWith('.'))
        {
            return false;
        }

        // ".ecg" beside a WFDB header of the same name is that record's annotations; otherwise an ISHNE file.
        if (ext.Equals(".ecg", StringComparison.OrdinalIgnoreCase))
        {
            return !File.Exists(System.IO.Path.ChangeExtension(file, ".hea"));
        }

        try
        {
            var format = RecordingOpener.Detect(file);
            return format is not null && format != RecordingFormat.Wfdb;
        }
        catch (RecordingFormatException)
        {
            return false;
        }
    }
}
