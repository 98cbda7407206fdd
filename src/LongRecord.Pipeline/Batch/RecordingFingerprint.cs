using System.Reflection;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.Json.Serialization;
using LongRecord.Analysis.Settings;
using LongRecord.Pipeline.Inputs;

namespace LongRecord.Pipeline.Batch;

/// <summary>
/// Everything that shapes one recording's outputs, written as <c>fingerprint.json</c> inside its output folder: the
/// tool version (with its source revision), the content (SHA-256) of the recording and of every side file
/// (<see cref="RecordingSideFiles"/>), the whole <see cref="SummaryOptions"/> record as JSON (so an option added to it
/// later is covered without a change here) and the analysis settings as used. A later run skips the recording only
/// when the digest of all this is unchanged.
/// </summary>
public sealed class RecordingFingerprint
{
    public const string FileName = "fingerprint.json";

    // Options proven not to change any output: the read block size (BlockSizeInvarianceTests) and the beats stage's
    // second thread (SecondBeatsThreadTests).
    private static readonly string[] s_notOutputAffecting = [nameof(SummaryOptions.BlockSamples), nameof(SummaryOptions.SecondBeatsThread)];

    private static readonly JsonSerializerOptions s_json = new() { Converters = { new FileSystemPathConverter() } };

    // The stored file is for people too: '+' and non-ASCII letters as themselves (the digest is over the compact form).
    private static readonly JsonSerializerOptions s_indented = new() { WriteIndented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping };

    private readonly JsonObject _document;

    private RecordingFingerprint(JsonObject document, string digest)
    {
        _document = document;
        Digest = digest;
    }

    /// <summary>The tool's full version, source revision included, so a rebuilt tool re-runs every recording.</summary>
    public static string ToolVersion { get; } =
        typeof(RecordingFingerprint).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion ?? "unknown";

    /// <summary>Hex SHA-256 of the document (without the digest itself).</summary>
    public string Digest { get; }

    /// <summary>Hashes the recording and its side files and combines them with the options and settings.</summary>
    /// <param name="listFolder">See <see cref="RecordingSideFiles.For"/>.</param>
    public static RecordingFingerprint Compute(RecordingInput input, SummaryOptions options, string? toolVersion = null, Func<string, IReadOnlyList<string>>? listFolder = null)
    {
        var optionsJson = OptionsJson(options);
        var folder = Path.GetDirectoryName(Path.GetFullPath(input.Path))!;
        var files = new JsonArray();
        foreach (var file in RecordingSideFiles.For(input, optionsJson, options.Beats, listFolder))
        {
            var (sha, bytes) = ContentHash.Of(file.Path);
            var under = file.Path.StartsWith(folder + Path.DirectorySeparatorChar, StringComparison.Ordinal);
            files.Add(new JsonObject
            {
                ["role"] = file.Role,
                // Names relative to the recording's folder (or the bare file name): no absolute paths in outputs; under
                // --deidentify no file names at all (they may name the patient), only the role and the order.
                ["name"] = options.Report.Privacy is not null
                    ? $"{file.Role}-{files.Count + 1}"
                    : (under ? Path.GetRelativePath(folder, file.Path) : Path.GetFileName(file.Path)).Replace('\\', '/'),
                ["bytes"] = bytes,
                ["sha256"] = sha,
            });
        }

        var document = new JsonObject
        {
            ["tool"] = "LongRecord",
            ["tool_version"] = toolVersion ?? ToolVersion,
            ["recording"] = new JsonObject { ["relative_path"] = input.RelativePath.Replace('\\', '/'), ["output_name"] = input.OutputName },
            ["files"] = files,
            ["options"] = optionsJson,
            ["settings"] = SettingsJson(options.Settings ?? AnalysisSettings.Default),
        };
        return new RecordingFingerprint(document, DigestOf(document));
    }

    /// <summary>The fingerprint stored in <paramref name="outputFolder"/>, or null when there is none or it cannot be read.</summary>
    public static RecordingFingerprint? Read(string outputFolder)
    {
        var path = Path.Combine(outputFolder, FileName);
        if (!File.Exists(path))
        {
            return null;
        }

        try
        {
            if (JsonNode.Parse(File.ReadAllText(path)) is not JsonObject o || o["digest"]?.GetValue<string>() is not string stored)
            {
                return null;
            }

            o.Remove("digest");
            // A stored digest that does not match its own document was edited or damaged: treat it as absent.
            return DigestOf(o) == stored ? new RecordingFingerprint(o, stored) : null;
        }
        catch (Exception e) when (e is JsonException or InvalidOperationException or IOException)
        {
            return null;
        }
    }

    /// <summary>Writes <c>fingerprint.json</c> into <paramref name="folder"/> (the output folder before it is committed).</summary>
    public void Write(string folder)
    {
        var copy = new JsonObject { ["digest"] = Digest };
        foreach (var (key, value) in _document)
        {
            copy[key] = value?.DeepClone();
        }

        File.WriteAllText(Path.Combine(folder, FileName), copy.ToJsonString(s_indented) + "\n");
    }

    /// <summary>
    /// Null when <paramref name="earlier"/> has the same digest; otherwise which part differs first (tool version,
    /// input files, options, settings), for the log.
    /// </summary>
    public string? DifferenceFrom(RecordingFingerprint? earlier)
    {
        if (earlier is null)
        {
            return "no earlier result";
        }

        if (earlier.Digest == Digest)
        {
            return null;
        }

        foreach (var (key, label) in new[] { ("tool_version", "tool version changed"), ("files", "input content changed"), ("options", "options changed"), ("settings", "settings changed") })
        {
            if (!JsonNode.DeepEquals(earlier._document[key], _document[key]))
            {
                return label;
            }
        }

        return "fingerprint changed";
    }

    /// <summary>The whole options record as JSON, without the settings (kept apart) and options that affect no output.</summary>
    public static JsonObject OptionsJson(SummaryOptions options)
    {
        var node = JsonSerializer.SerializeToNode(options with { Settings = null }, s_json)!.AsObject();
        node.Remove(nameof(SummaryOptions.Settings));
        foreach (var name in s_notOutputAffecting)
        {
            node.Remove(name);
        }

        // Under --deidentify a path given as an option (--beats FILE, --diary FILE) may name the patient: its content is
        // in the file list already, so the path itself is withheld.
        if (options.Report.Privacy is not null)
        {
            foreach (var (name, value) in node.ToArray())
            {
                if (value is JsonValue v && v.TryGetValue<string>(out var text) && (text.Contains('/') || text.Contains('\\') || File.Exists(text)))
                {
                    node[name] = "file (withheld)";
                }
            }
        }

        // The report options by what they change: the template as loaded, and under --deidentify the key's identity.
        node["Report"] = new JsonObject
        {
            ["enabled"] = options.Report.Enabled,
            ["template"] = JsonSerializer.SerializeToNode(options.Report.Template),
            ["deidentify"] = options.Report.Privacy is not null,
            ["key_id"] = options.Report.Privacy?.KeyId,
        };
        return node;
    }

    private static JsonNode SettingsJson(AnalysisSettings settings)
    {
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream))
        {
            settings.WriteTo(w);
        }

        return JsonNode.Parse(stream.ToArray())!;
    }

    private static string DigestOf(JsonObject document) =>
        Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(document.ToJsonString())));

    // A file or folder option is fingerprinted by its path (its content through RecordingSideFiles), never by its
    // timestamps, which would change the fingerprint on every run.
    private sealed class FileSystemPathConverter : JsonConverterFactory
    {
        public override bool CanConvert(Type typeToConvert) => typeof(FileSystemInfo).IsAssignableFrom(typeToConvert);

        public override JsonConverter CreateConverter(Type typeToConvert, JsonSerializerOptions options) =>
            (JsonConverter)Activator.CreateInstance(typeof(PathConverter<>).MakeGenericType(typeToConvert))!;

        private sealed class PathConverter<T> : JsonConverter<T>
            where T : FileSystemInfo
        {
            public override T Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) =>
                throw new NotSupportedException("fingerprints are written, never read back into options");

            public override void Write(Utf8JsonWriter writer, T value, JsonSerializerOptions options) => writer.WriteStringValue(value.FullName);
        }
    }
}
