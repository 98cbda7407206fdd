using BenchmarkDotNet.Attributes;
using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Rhythm;
using LongRecord.Pipeline;

namespace LongRecord.Benchmarks.Analysis;

/// <summary>
/// The rhythm stage over one day of beats (the demo day's detected beats, about 93 000). Target (rhythm issue):
/// ≤ 0.2 s per day of beats; memory per beat under 64 bytes.
/// </summary>
[MemoryDiagnoser]
public class RhythmBenchmarks
{
    private RhythmInput _input = null!;

    [GlobalSetup]
    public void Setup() => _input = DayOfBeats();

    [Benchmark]
    public int RhythmOneDay() => RhythmAnalyser.Analyse(_input).Episodes.Count;

    public static RhythmInput DayOfBeats()
    {
        var a = RecordingSummariser.Analyse(BeatRecordings.DemoDay());
        return new RhythmInput
        {
            Beats = a.Beats.ToArray(),
            ReferenceRateHz = a.ReferenceRateHz,
            DurationS = a.DurationS,
            StartDateTime = a.Info.StartDateTime,
            Stretches = a.Quality.Select(q => new SignalStretch(q.StartS, q.EndS, q.Analysable)).ToArray(),
        };
    }
}
