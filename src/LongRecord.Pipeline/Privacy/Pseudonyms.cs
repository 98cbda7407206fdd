using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using LongRecord.Formats;
using LongRecord.Pipeline.Inputs;

namespace LongRecord.Pipeline.Privacy;

/// <summary>
/// De-identification: each recording is known by a pseudonym, a keyed hash (HMAC-SHA-256) of its path relative to
/// its input root, so the same input gets the same pseudonym in every run and every shard that uses the same key.
/// With a key file, the key is read from it (or a new one is made and written there) and the mapping from pseudonym to
/// path, name, ID and birth date is kept in it — and nowhere else. Without one, a fresh key serves this run only and no
/// mapping is written.
/// </summary>
public sealed class Pseudonyms
{
    /// <summary>Prefix of every pseudonym (also a safe folder name).</summary>
    public const string Prefix = "anon-";

    private const int KeyBytes = 32;
    private readonly byte[] _key;
    private readonly string? _keyFile;
    private readonly SortedDictionary<string, PseudonymEntry> _entries = new(StringComparer.Ordinal);
    private readonly Dictionary<string, string> _paths = new(StringComparer.Ordinal);
    private readonly object _gate = new();

    private Pseudonyms(byte[] key, string? keyFile, IEnumerable<PseudonymEntry> entries)
    {
        _key = key;
        _keyFile = keyFile;
        foreach (var e in entries)
        {
            _entries[e.Pseudonym] = e;
        }
    }

    /// <summary>Keyed by the file at <paramref name="keyFile"/> (created with a new key when absent), or by a fresh key when null.</summary>
    public static Pseudonyms Open(string? keyFile)
    {
        if (keyFile is null)
        {
            return new Pseudonyms(RandomNumberGenerator.GetBytes(KeyBytes), null, []);
        }

        if (!File.Exists(keyFile))
        {
            var created = new Pseudonyms(RandomNumberGenerator.GetBytes(KeyBytes), Path.GetFullPath(keyFile), []);
            created.Save();
            return created;
        }

        try
        {
            var file = JsonSerializer.Deserialize<KeyFile>(File.ReadAllText(keyFile)) ?? throw new JsonException("empty");
            var key = Convert.FromBase64String(file.Key ?? "");
            if (key.Length < 16)
            {
                throw new PseudonymKeyException($"{keyFile}: the key is shorter than 16 bytes");
            }

            return new Pseudonyms(key, Path.GetFullPath(keyFile), file.Pseudonyms ?? []);
        }
        catch (Exception e) when (e is JsonException or FormatException)
        {
            throw new PseudonymKeyException($"{keyFile}: not a LongRecord key file ({e.Message})");
        }
    }

    /// <summary>
    /// A short digest that names the key without revealing it: two runs with the same key file agree, a run with a
    /// fresh key differs (its pseudonyms, and so its outputs, differ too).
    /// </summary>
    public string KeyId => Convert.ToHexStringLower(SHA256.HashData(_key), 0, 8);

    /// <summary>The pseudonym of a path relative to its input root (separators normalised, so shards on any OS agree).</summary>
    public string For(string relativePath)
    {
        var normalised = relativePath.Replace('\\', '/');
        var hash = HMACSHA256.HashData(_key, Encoding.UTF8.GetBytes(normalised));
        return Prefix + Convert.ToHexStringLower(hash, 0, 6);
    }

    /// <summary>The input as it is shown and written: its name, relative path and output folder all the pseudonym.</summary>
    public RecordingInput Apply(RecordingInput input)
    {
        var p = For(input.RelativePath);
        lock (_gate)
        {
            _paths[p] = input.RelativePath;
        }

        return input with { RelativePath = p, Name = p, OutputName = p };
    }

    /// <summary>A one-line error with the input's path and file name replaced by its pseudonym.</summary>
    public string Redact(string message, RecordingInput original, RecordingFormatException? error = null)
    {
        var p = For(original.RelativePath);
        foreach (var s in new[] { error?.FilePath, Path.GetFullPath(original.Path), original.Path, original.RelativePath, Path.GetFileName(original.Path), original.Name }
                     .Where(s => !string.IsNullOrEmpty(s)).Distinct().OrderByDescending(s => s!.Length))
        {
            message = message.Replace(s!, p, StringComparison.Ordinal);
        }

        return message;
    }

    /// <summary>
    /// Keeps the mapping of <paramref name="pseudonym"/> (given out by <see cref="Apply"/>) in the key file, when there
    /// is one; the file is rewritten whole under a temporary name.
    /// </summary>
    public void Remember(string pseudonym, Identification identification)
    {
        if (_keyFile is null)
        {
            return;
        }

        lock (_gate)
        {
            _entries[pseudonym] = new PseudonymEntry
            {
                Pseudonym = pseudonym,
                RelativePath = _paths.GetValueOrDefault(pseudonym, ""),
                PatientName = identification.PatientName,
                PatientId = identification.PatientId,
                BirthDate = identification.BirthDate,
            };
            Save();
        }
    }

    private void Save()
    {
        var temp = $"{_keyFile}.partial-{Guid.NewGuid():N}";
        var file = new KeyFile
        {
            Purpose = "LongRecord pseudonym key and mapping. Keep it secret: it turns pseudonyms back into patients.",
            Key = Convert.ToBase64String(_key),
            Pseudonyms = [.. _entries.Values],
        };
        File.WriteAllText(temp, JsonSerializer.Serialize(file, new JsonSerializerOptions { WriteIndented = true }));
        File.Move(temp, _keyFile!, overwrite: true);
    }

    private sealed class KeyFile
    {
        [System.Text.Json.Serialization.JsonPropertyName("purpose")]
        public string? Purpose { get; set; }

        [System.Text.Json.Serialization.JsonPropertyName("key")]
        public string? Key { get; set; }

        [System.Text.Json.Serialization.JsonPropertyName("pseudonyms")]
        public List<PseudonymEntry>? Pseudonyms { get; set; }
    }
}
