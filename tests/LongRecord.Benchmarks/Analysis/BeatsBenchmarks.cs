using BenchmarkDotNet.Attributes;
using LongRecord.Formats;
using LongRecord.Pipeline;
using LongRecord.Pipeline.Channels;

namespace LongRecord.Benchmarks.Analysis;

/// <summary>
/// The beats stage (conditioning, detection, delineation, classification, quality) over a 24 h two-lead 250 Hz
/// recording (43.2 M samples), read from EDF+ on one thread. Target (beats issue): ≤ 2 s, peak memory ≤ 250 MB.
/// </summary>
[MemoryDiagnoser]
public class BeatsBenchmarks
{
    private string _edf = "";

    [GlobalSetup]
    public void Setup() => _edf = BeatRecordings.DemoDay();

    [Benchmark]
    public int Beats24h() => Run(_edf);

    public static LongRecord.Analysis.Beats.BeatStageTimings? LastTimings { get; private set; }

    public static int Run(string path)
    {
        using var reader = RecordingOpener.Open(path);
        var channels = EcgChannelSelector.Select(reader.Info);
        var analyser = RecordingSummariser.DetectBeats(reader, channels, 1 << 16);
        LastTimings = analyser.Timings;
        return analyser.Beats.Count;
    }
}
