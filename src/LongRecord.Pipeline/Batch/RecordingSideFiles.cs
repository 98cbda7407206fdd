using System.Text.Json.Nodes;
using LongRecord.Formats;
using LongRecord.Formats.Wfdb;
using LongRecord.Pipeline.Inputs;

namespace LongRecord.Pipeline.Batch;

/// <summary>One file whose content shapes a recording's outputs, and why it counts.</summary>
/// <param name="Role"><c>recording</c>, <c>signal</c> (a WFDB signal file its header names), <c>beside</c> (a file named
/// after the recording in its folder: annotations, a diary), <c>beats</c> (the <c>--beats</c> file) or
/// <c>option:NAME</c> (a file an option names).</param>
public sealed record SideFile(string Role, string Path);

/// <summary>
/// Every file that can change what a recording's outputs say: the recording itself, the WFDB signal files its header
/// names, every file beside it named after it (<c>NAME.*</c>: WFDB annotators such as <c>.atr</c> and <c>.qrs</c>, a
/// <c>NAME.diary.csv</c>), the <c>--beats</c> file, and any existing file that an option names (diary, template, key
/// file…), found in the options' JSON so that options added later are covered without a change here.
/// </summary>
public static class RecordingSideFiles
{
    /// <param name="listFolder">Lists a folder's files; a batch passes one that lists each folder once, so a folder of
    /// thousands of recordings is not listed once per recording. Null lists it now.</param>
    public static IReadOnlyList<SideFile> For(RecordingInput input, JsonObject optionsJson, string? beatsSpec, Func<string, IReadOnlyList<string>>? listFolder = null)
    {
        var files = new List<SideFile> { new("recording", System.IO.Path.GetFullPath(input.Path)) };
        var folder = System.IO.Path.GetDirectoryName(System.IO.Path.GetFullPath(input.Path))!;
        if (input.Path.EndsWith(".hea", StringComparison.OrdinalIgnoreCase))
        {
            foreach (var signal in SignalFiles(input.Path, folder))
            {
                files.Add(new SideFile("signal", signal));
            }
        }

        var stem = System.IO.Path.GetFileNameWithoutExtension(input.Path);
        var prefix = System.IO.Path.Combine(folder, stem + ".");
        foreach (var beside in (listFolder ?? Directory.GetFiles)(folder).Where(f => f.StartsWith(prefix, StringComparison.Ordinal)).Order(StringComparer.Ordinal))
        {
            files.Add(new SideFile("beside", beside));
        }

        if (beatsSpec is not null)
        {
            var beats = File.Exists(beatsSpec) ? beatsSpec : System.IO.Path.ChangeExtension(input.Path, beatsSpec.TrimStart('.'));
            if (File.Exists(beats))
            {
                files.Add(new SideFile("beats", System.IO.Path.GetFullPath(beats)));
            }
        }

        foreach (var (name, value) in StringLeaves(optionsJson, ""))
        {
            if (value.Length > 0 && File.Exists(value))
            {
                files.Add(new SideFile("option:" + name, System.IO.Path.GetFullPath(value)));
            }
        }

        // A file counts once, under the first role that found it.
        return files.DistinctBy(f => f.Path, StringComparer.Ordinal).ToArray();
    }

    private static IEnumerable<string> SignalFiles(string headerPath, string folder)
    {
        WfdbHeader header;
        try
        {
            header = WfdbHeader.Parse(headerPath);
        }
        catch (RecordingFormatException)
        {
            // A header that does not parse fails in the analysis with its own message; its bytes are still fingerprinted.
            yield break;
        }

        foreach (var name in header.Signals.Select(s => s.FileName).Distinct(StringComparer.Ordinal))
        {
            var path = System.IO.Path.GetFullPath(System.IO.Path.Combine(folder, name));
            if (name != "~" && File.Exists(path))
            {
                yield return path;
            }
        }
    }

    private static IEnumerable<(string Name, string Value)> StringLeaves(JsonNode? node, string name)
    {
        switch (node)
        {
            case JsonObject o:
                foreach (var (key, child) in o)
                {
                    foreach (var leaf in StringLeaves(child, name.Length == 0 ? key : $"{name}.{key}"))
                    {
                        yield return leaf;
                    }
                }

                break;
            case JsonArray a:
                foreach (var child in a)
                {
                    foreach (var leaf in StringLeaves(child, name))
                    {
                        yield return leaf;
                    }
                }

                break;
            case JsonValue v when v.TryGetValue<string>(out var s):
                yield return (name, s);
                break;
        }
    }
}
