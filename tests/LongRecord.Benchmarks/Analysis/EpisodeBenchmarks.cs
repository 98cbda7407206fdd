using System.Diagnostics;
using BenchmarkDotNet.Attributes;
using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Quality;
using LongRecord.Analysis.Rhythm;
using LongRecord.Analysis.Settings;
using LongRecord.Formats;
using LongRecord.Pipeline;
using LongRecord.Pipeline.Channels;

namespace LongRecord.Benchmarks.Analysis;

/// <summary>
/// The episode stage over the synthetic demo day (24 h, two leads, 250 Hz, EDF+): candidates, their signal read back
/// and conditioned, classification, bigeminy, review and the symptom table. Target (episodes issue): no more than
/// 20 % of the time of beats + rhythm for the same day. <c>--episodes</c> prints the three times and the ratio.
/// </summary>
[MemoryDiagnoser]
public class EpisodeBenchmarks
{
    private Day _day = null!;

    [GlobalSetup]
    public void Setup() => _day = Day.Load(BeatRecordings.DemoDay());

    [Benchmark]
    public int EpisodesOneDay() => _day.Episodes();

    /// <summary>Beats, rhythm and episodes of the demo day timed one after the other (best of <paramref name="repeats"/>).</summary>
    public static void Short(int repeats = 3)
    {
        var path = BeatRecordings.DemoDay();
        double beatsS = double.MaxValue, rhythmS = double.MaxValue, episodesS = double.MaxValue;
        Day? day = null;
        var count = 0;
        for (var i = 0; i < repeats; i++)
        {
            var sw = Stopwatch.StartNew();
            day = Day.Load(path);
            beatsS = Math.Min(beatsS, sw.Elapsed.TotalSeconds);
            sw.Restart();
            day.Rhythm();
            rhythmS = Math.Min(rhythmS, sw.Elapsed.TotalSeconds);
            sw.Restart();
            count = day.Episodes();
            episodesS = Math.Min(episodesS, sw.Elapsed.TotalSeconds);
        }

        Console.WriteLine(FormattableString.Invariant(
            $"benchmark episodes stage, demo day 24 h ({day!.Beats.Length} beats, {count} episodes): beats {beatsS:F2} s, rhythm {rhythmS:F3} s, episodes {episodesS:F3} s = {100 * episodesS / (beatsS + rhythmS):F1} % of beats + rhythm (target ≤ 20 %; best of {repeats}, one thread)"));
    }

    private sealed class Day
    {
        private readonly string _path;
        private RhythmResult? _rhythm;

        private Day(string path, Beat[] beats, QualityStretch[] quality, double rateHz, double durationS)
        {
            _path = path;
            Beats = beats;
            Quality = quality;
            RateHz = rateHz;
            DurationS = durationS;
        }

        public Beat[] Beats { get; }
        public QualityStretch[] Quality { get; }
        public double RateHz { get; }
        public double DurationS { get; }

        public static Day Load(string path)
        {
            using var reader = RecordingOpener.Open(path);
            var channels = EcgChannelSelector.Select(reader.Info);
            var analyser = RecordingSummariser.DetectBeats(reader, channels, 1 << 16);
            return new Day(path, analyser.Beats.ToArray(), analyser.Quality.ToArray(), channels.ReferenceRateHz, reader.Info.DurationS);
        }

        public RhythmResult Rhythm()
        {
            using var reader = RecordingOpener.Open(_path);
            _rhythm = RhythmAnalyser.Analyse(new RhythmInput
            {
                Beats = Beats,
                ReferenceRateHz = RateHz,
                DurationS = DurationS,
                StartDateTime = reader.Info.StartDateTime,
                Stretches = Quality.Select(q => new SignalStretch(q.StartS, q.EndS, q.Analysable, q.Analysable ? "" : q.Reason.Code())).ToArray(),
            });
            return _rhythm;
        }

        public int Episodes()
        {
            var rhythm = _rhythm ?? Rhythm();
            using var reader = RecordingOpener.Open(_path);
            var stretches = Quality.Select(q => new SignalStretch(q.StartS, q.EndS, q.Analysable, q.Analysable ? "" : q.Reason.Code())).ToArray();
            var result = EpisodeStage.Run(reader, EcgChannelSelector.Select(reader.Info), Beats, stretches, rhythm, AnalysisSettings.Default, RateHz, DurationS, null);
            return result.Episodes.Count;
        }
    }
}
