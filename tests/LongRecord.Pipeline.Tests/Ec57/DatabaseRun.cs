using System.Collections.Concurrent;
using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Quality;
using LongRecord.Formats;
using LongRecord.Formats.Wfdb;
using LongRecord.Pipeline.Channels;
using LongRecord.TestSupport;

namespace LongRecord.Pipeline.Tests.Ec57;

/// <summary>
/// A PhysioNet record analysed through the product's own path (format detection, channel choice, block reads, the beats
/// stage), with its reference annotations. Results are kept for the test run: several checks share one analysis.
/// </summary>
public sealed record RecordRun(string Database, string Record, double SamplingRateHz, long SampleCount, IReadOnlyList<Beat> Beats, IReadOnlyList<QualityStretch> Quality, IReadOnlyList<WfdbAnnotation> Reference)
{
    private static readonly ConcurrentDictionary<string, Lazy<RecordRun>> s_runs = new();

    public ReferenceBeats ReferenceBeats => Ec57.ReferenceBeats.From(Reference, SampleCount);

    public BeatMatch Match() => new(Record, ReferenceBeats, Beats, SamplingRateHz);

    /// <summary>Percentage of the record's time our quality marking left out.</summary>
    public double UnanalysablePercent => 100.0 * Quality.Where(q => !q.Analysable).Sum(q => q.DurationS) / (SampleCount / SamplingRateHz);

    public static RecordRun Get(string database, string record, string annotator = "atr", int blockSamples = 1 << 16) =>
        s_runs.GetOrAdd($"{database}/{record}/{annotator}/{blockSamples}", _ => new Lazy<RecordRun>(() => Analyse(database, record, annotator, blockSamples))).Value;

    /// <summary>All records of a database present in ../shared/data, analysed on both cores.</summary>
    public static IReadOnlyList<RecordRun> All(string database, string annotator = "atr")
    {
        var names = SharedData.Records(database).Where(r => File.Exists(Path.Combine(SharedData.Physionet(database), r + "." + annotator))).ToArray();
        var runs = new RecordRun[names.Length];
        Parallel.For(0, names.Length, new ParallelOptions { MaxDegreeOfParallelism = Environment.ProcessorCount }, i => runs[i] = Get(database, names[i], annotator));
        return runs;
    }

    private static RecordRun Analyse(string database, string record, string annotator, int blockSamples)
    {
        var folder = SharedData.Physionet(database);
        using var reader = RecordingOpener.Open(Path.Combine(folder, record + ".hea"));
        var channels = EcgChannelSelector.Select(reader.Info);
        var analyser = RecordingSummariser.DetectBeats(reader, channels, blockSamples);
        var reference = WfdbAnnotationReader.Read(Path.Combine(folder, record + "." + annotator));
        return new RecordRun(database, record, channels.ReferenceRateHz, channels.SampleCount, analyser.Beats.ToArray(), analyser.Quality.ToArray(), reference);
    }
}
