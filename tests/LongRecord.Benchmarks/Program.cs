using System.Diagnostics;
using BenchmarkDotNet.Running;
using LongRecord.Benchmarks.Analysis;
using LongRecord.Benchmarks.Formats;

namespace LongRecord.Benchmarks;

/// <summary>
/// <c>dotnet run -c Release --project tests/LongRecord.Benchmarks</c> runs the BenchmarkDotNet suites;
/// <c>-- --short</c> prints quick figures (used by CI: figures only, never a gate);
/// <c>-- --memory</c> reads a 72 h recording and prints the peak working set;
/// <c>-- --ltafdb</c> re-analyses every LTAFDB record present from its .qrs beats and prints the time;
/// <c>-- --batch</c> prints the batch issue's figures (<c>--single</c>: the 72 h recording only; <c>--one-thread</c>: its beats stage on one thread);
/// <c>-- --beats-72h</c> times the beats stage alone on the 72 h recording, one thread: a first pass with start-up compilation, then three (their median is the figure);
/// <c>-- --episodes</c> times beats, rhythm and episodes of the 24 h demo day.
/// </summary>
public static class Program
{
    public static int Main(string[] args)
    {
        if (args.Contains("--short"))
        {
            Short();
            return 0;
        }

        if (args.Contains("--beats-72h"))
        {
            Batch.BatchBenchmarks.BeatsStageAlone();
            return 0;
        }

        if (args.Contains("--batch"))
        {
            Batch.BatchBenchmarks.Run(skipFolder: args.Contains("--single"), oneThread: args.Contains("--one-thread"));
            return 0;
        }

        if (args.Contains("--episodes"))
        {
            EpisodeBenchmarks.Short();
            return 0;
        }

        if (args.Contains("--ltafdb"))
        {
            LtafdbRhythmRun.Run();
            return 0;
        }

        if (args.Contains("--memory"))
        {
            Memory();
            return 0;
        }

        BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
        return 0;
    }

    private static void Short()
    {
        var buffer = new float[2 * 60 * 250];
        foreach (var (name, path) in new[] { ("EDF+ decode", BenchmarkRecordings.Edf(2)), ("WFDB 212 decode", BenchmarkRecordings.Wfdb212(2)) })
        {
            DecodeBenchmarks.DecodeAll(path, buffer);
            var best = double.MaxValue;
            for (var i = 0; i < 5; i++)
            {
                var sw = Stopwatch.StartNew();
                DecodeBenchmarks.DecodeAll(path, buffer);
                best = Math.Min(best, sw.Elapsed.TotalSeconds);
            }

            var samples = 2 * 2 * 3600 * BenchmarkRecordings.RateHz;
            Console.WriteLine(FormattableString.Invariant($"benchmark {name}, 2 h two-lead 250 Hz: {samples / best / 1e6:F0} M samples/s (best of 5, one thread)"));
        }

        var demo = BeatRecordings.DemoDay(2);
        // Warm-up: a 2 h pass takes about 0.15 s, too short for the runtime's tiered compiler to have promoted every
        // hot method after one pass (the first timed passes of a fresh clone ran up to 40 % slower than later ones).
        for (var i = 0; i < 4; i++)
        {
            BeatsBenchmarks.Run(demo);
        }

        // Wall time swings with other work on a shared machine; the process's CPU time for the same run swings less
        // (one analysis thread; the GC's threads are counted too, so it is a slight over-estimate).
        var fastest = double.MaxValue;
        var leastCpu = double.MaxValue;
        var process = Process.GetCurrentProcess();
        var allocated0 = GC.GetTotalAllocatedBytes(precise: true);
        var collections0 = GC.CollectionCount(0);
        for (var i = 0; i < 5; i++)
        {
            process.Refresh();
            var cpu0 = process.TotalProcessorTime;
            var sw = Stopwatch.StartNew();
            BeatsBenchmarks.Run(demo);
            fastest = Math.Min(fastest, sw.Elapsed.TotalSeconds);
            process.Refresh();
            leastCpu = Math.Min(leastCpu, (process.TotalProcessorTime - cpu0).TotalSeconds);
        }

        var beatsAllocated = (GC.GetTotalAllocatedBytes(precise: true) - allocated0) / 5.0;
        var beatsCollections = (GC.CollectionCount(0) - collections0) / 5.0;
        Console.WriteLine("  stages of the last 2 h pass (multiply by 12 for 24 h): " + BeatsBenchmarks.LastTimings);
        Console.WriteLine(FormattableString.Invariant($"  allocated per 24 h: {beatsAllocated * 12 / 1048576:F0} MB, {beatsCollections * 12:F0} gen-0 collections"));
        var day = RhythmBenchmarks.DayOfBeats();
        LongRecord.Analysis.Rhythm.RhythmAnalyser.Analyse(day);
        var rhythmBest = double.MaxValue;
        var allocated = 0L;
        for (var i = 0; i < 5; i++)
        {
            var before = GC.GetAllocatedBytesForCurrentThread();
            var sw = Stopwatch.StartNew();
            LongRecord.Analysis.Rhythm.RhythmAnalyser.Analyse(day);
            rhythmBest = Math.Min(rhythmBest, sw.Elapsed.TotalSeconds);
            allocated = GC.GetAllocatedBytesForCurrentThread() - before;
        }

        Console.WriteLine(FormattableString.Invariant($"benchmark rhythm stage, one day ({day.Beats.Length} beats): {rhythmBest:F3} s, {allocated / (double)day.Beats.Length:F1} bytes allocated per beat (best of 5)"));
        var n = 2 * 2 * 3600 * 250.0;
        Console.WriteLine(FormattableString.Invariant($"benchmark beats stage, 2 h two-lead 250 Hz demo: {n / fastest / 1e6:F1} M samples/s = {fastest * 12:F2} s per 24 h wall, {leastCpu * 12:F2} s per 24 h of CPU (best of 5, one thread)"));
    }

    private static void Memory()
    {
        var path = BenchmarkRecordings.Edf(72);
        var before = Process.GetCurrentProcess().PeakWorkingSet64;
        var sw = Stopwatch.StartNew();
        DecodeBenchmarks.DecodeAll(path, new float[2 * 60 * 250]);
        var peak = Process.GetCurrentProcess().PeakWorkingSet64;
        Console.WriteLine(FormattableString.Invariant($"72 h two-lead EDF+ read in {sw.Elapsed.TotalSeconds:F2} s; peak working set {peak / 1048576.0:F0} MB (before reading {before / 1048576.0:F0} MB)"));
    }
}
