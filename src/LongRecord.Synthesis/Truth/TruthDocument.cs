using System.Globalization;
using System.Text.Json;
using System.Text.Json.Serialization;

namespace LongRecord.Synthesis.Truth;

/// <summary>
/// The truth file written beside a synthetic recording (System.Text.Json, camelCase, enums as strings). Times are in
/// seconds from the first sample, samples are 0-based indices at <see cref="SamplingRateHz"/>.
/// </summary>
public sealed record TruthDocument
{
    public const string FormatName = "longrecord-synthesis-truth";

    public string Format { get; init; } = FormatName;
    public int Version { get; init; } = 1;
    public required string Scenario { get; init; }
    public required ulong Seed { get; init; }
    public required double SamplingRateHz { get; init; }
    public required double DurationS { get; init; }
    public required long SampleCount { get; init; }

    /// <summary>Local start, ISO 8601 without offset.</summary>
    public required string StartDateTime { get; init; }

    public required IReadOnlyList<string> Leads { get; init; }
    public required IReadOnlyDictionary<string, string> Definitions { get; init; }
    public required IReadOnlyList<TruthBeat> Beats { get; init; }
    public required IReadOnlyList<TruthPWave> PWaves { get; init; }
    public required IReadOnlyList<RhythmInterval> Rhythms { get; init; }
    public required IReadOnlyList<NoiseInterval> Noise { get; init; }

    private static readonly JsonSerializerOptions s_options = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        Converters = { new JsonStringEnumConverter() },
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
    };

    public static TruthDocument From(SyntheticRecording recording) => new()
    {
        Scenario = recording.Scenario.Name,
        Seed = recording.Seed,
        SamplingRateHz = recording.SamplingRateHz,
        DurationS = recording.DurationS,
        SampleCount = recording.SampleCount,
        StartDateTime = recording.StartDateTime.ToString("yyyy-MM-ddTHH:mm:ss", CultureInfo.InvariantCulture),
        Leads = recording.Leads,
        Definitions = s_definitions,
        // The lazy view: the serializer enumerates it while writing, so the beat list is never copied.
        Beats = recording.Truth.Beats,
        PWaves = recording.Truth.PWaves,
        Rhythms = recording.Truth.Rhythms,
        Noise = recording.Truth.Noise,
    };

    public void Write(Stream stream) => JsonSerializer.Serialize(stream, this, s_options);

    /// <summary>Writes to <paramref name="path"/> through a temporary file renamed when complete.</summary>
    public void Save(string path)
    {
        var temp = path + ".partial";
        using (var stream = new FileStream(temp, FileMode.Create, FileAccess.Write, FileShare.None))
        {
            Write(stream);
        }

        File.Move(temp, path, overwrite: true);
    }

    public static TruthDocument Read(Stream stream) =>
        JsonSerializer.Deserialize<TruthDocument>(stream, s_options) ?? throw new JsonException("the truth file is empty");

    public static TruthDocument Load(string path)
    {
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read);
        return Read(stream);
    }

    private static readonly IReadOnlyDictionary<string, string> s_definitions = new Dictionary<string, string>
    {
        ["rTimeS"] = "fiducial point: time of the largest absolute excursion of the beat's Q+R+S Gaussian sum in the first lead",
        ["qrsOnsetS"] = "earliest time, over all leads, at which a lead's Q+R+S sum reaches 2 % of its own largest absolute excursion",
        ["qrsOffsetS"] = "latest such time",
        ["tEndS"] = "time after the T peak where the T Gaussian falls to 2 % of its peak (centre + 2.797 widths)",
        ["pPeakS"] = "reference time of the P wave: the peak of a monophasic P, the midpoint of a biphasic P",
        ["snrDb"] = "10 log10(S/N); S = (median clean QRS peak-to-peak amplitude of the lead over the stretch)^2 / 8, N = mean square of the added noise over the stretch",
        ["rhythmExtent"] = "beat rhythms run from the R time of their first beat to that of their last; ventricular flutter/fibrillation over the scripted stretch; a pause from the R before it to the R after it",
    };
}
