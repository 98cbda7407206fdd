using System.Collections.Concurrent;
using LongRecord.Analysis.Episodes;
using LongRecord.Analysis.Settings;
using LongRecord.Formats;
using LongRecord.Pipeline.Tests.Ec57;
using LongRecord.TestSupport;

namespace LongRecord.Pipeline.Tests.Episodes;

/// <summary>
/// A PhysioNet record's episodes through the product's path: the beats of the shared EC57 analysis
/// (<see cref="RecordRun"/>, detected once per test run), then the rhythm and episode stages on the record's own signal.
/// Kept for the test run, so every check on a database shares one analysis.
/// </summary>
public sealed record DatabaseEpisodes(RecordRun Run, EpisodeResult Result)
{
    private static readonly ConcurrentDictionary<string, Lazy<DatabaseEpisodes>> s_cache = new();

    public string Record => Run.Record;

    public double RateHz => Run.SamplingRateHz;

    public double DurationS => Run.SampleCount / Run.SamplingRateHz;

    public static DatabaseEpisodes Get(string database, string record) =>
        s_cache.GetOrAdd($"{database}/{record}", _ => new Lazy<DatabaseEpisodes>(() => Analyse(database, record))).Value;

    /// <summary>Every record of the database present (with its <c>.atr</c>), on both cores.</summary>
    public static IReadOnlyList<DatabaseEpisodes> All(string database)
    {
        var names = SharedData.Records(database).Where(r => File.Exists(Path.Combine(SharedData.Physionet(database), r + ".atr"))).ToArray();
        var list = new DatabaseEpisodes[names.Length];
        Parallel.For(0, names.Length, new ParallelOptions { MaxDegreeOfParallelism = Environment.ProcessorCount }, i => list[i] = Get(database, names[i]));
        return list;
    }

    private static DatabaseEpisodes Analyse(string database, string record)
    {
        var run = RecordRun.Get(database, record);
        using var reader = RecordingOpener.Open(Path.Combine(SharedData.Physionet(database), record + ".hea"));
        var (_, episodes) = RecordingSummariser.RhythmAndEpisodes(reader, run.Beats, run.Quality, run.SamplingRateHz, reader.Info.DurationS, AnalysisSettings.Default);
        return new DatabaseEpisodes(run, episodes);
    }
}
