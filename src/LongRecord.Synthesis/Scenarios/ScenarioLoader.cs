using System.Globalization;
using System.Text;
using System.Text.Json;
using LongRecord.Formats;
using LongRecord.Synthesis.Model;

namespace LongRecord.Synthesis.Scenarios;

/// <summary>
/// Reads a scenario JSON file (schema in <c>fixtures/scenarios/README.md</c>). Every problem found is reported at once
/// in one <see cref="RecordingFormatException"/> whose one-line message lists them all, each naming its field path
/// (for example <c>segments[2] (af).rrCv</c>).
/// </summary>
public static class ScenarioLoader
{
    /// <summary>Reads and validates the scenario file at <paramref name="path"/> (opened read-only).</summary>
    public static Scenario Load(string path)
    {
        byte[] bytes;
        try
        {
            bytes = File.ReadAllBytes(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new RecordingFormatException(path, $"cannot read the scenario: {e.Message}", inner: e);
        }

        return Parse(bytes, path);
    }

    /// <summary>Parses scenario JSON text; <paramref name="sourceName"/> names it in error messages.</summary>
    public static Scenario Parse(string json, string sourceName = "<scenario>") => Parse(Encoding.UTF8.GetBytes(json), sourceName);

    private static Scenario Parse(byte[] utf8, string sourceName)
    {
        JsonDocument doc;
        try
        {
            doc = JsonDocument.Parse(utf8, new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
        }
        catch (JsonException e)
        {
            throw new RecordingFormatException(sourceName, $"not valid JSON: {FirstLine(e.Message)}", ByteOffsetOf(utf8, e), "json");
        }

        using (doc)
        {
            var errors = new List<string>();
            var scenario = ScenarioReader.Read(doc.RootElement, errors);
            if (errors.Count > 0 || scenario is null)
            {
                var list = errors.Count == 0 ? ["the scenario is empty"] : errors;
                var field = list[0].Split(':')[0];
                throw new RecordingFormatException(
                    sourceName, $"{list.Count} problem{(list.Count == 1 ? "" : "s")} in the scenario: {string.Join("; ", list)}", null, field);
            }

            return scenario;
        }
    }

    private static string FirstLine(string s) => s.Split('\n')[0].Trim();

    // JsonException gives a line number and a byte position in that line; turn them into a file byte offset.
    private static long? ByteOffsetOf(byte[] utf8, JsonException e)
    {
        if (e.LineNumber is not long line || e.BytePositionInLine is not long inLine)
        {
            return null;
        }

        long offset = 0;
        for (long l = 0; l < line && offset < utf8.Length; offset++)
        {
            if (utf8[offset] == (byte)'\n')
            {
                l++;
            }
        }

        return Math.Min(offset + inLine, utf8.Length);
    }

    internal static bool TryParseTime(string s, out TimeOnly time) =>
        TimeOnly.TryParseExact(s, ["HH:mm", "HH:mm:ss"], CultureInfo.InvariantCulture, DateTimeStyles.None, out time);

    internal static bool TryParseView(string s, out LeadView view) => Enum.TryParse(s, ignoreCase: false, out view) && Enum.IsDefined(view);
}
