using System.Diagnostics;
using System.Globalization;
using LongRecord.Formats;
using LongRecord.Pipeline;
using LongRecord.Pipeline.Batch;
using LongRecord.Pipeline.Inputs;
using LongRecord.Synthesis;
using LongRecord.Synthesis.Export;
using LongRecord.Synthesis.Model;
using LongRecord.Synthesis.Scenarios;

namespace LongRecord.Benchmarks.Batch;

/// <summary>
/// The batch issue's speed and memory figures, printed (never a gate): the whole summary of a 72 h, 3-lead, 256 Hz
/// recording (199 M samples) against a bare decode pass over the same file in the same run, its peak memory, and a
/// folder of 8 recordings of 24 h with two jobs. Recordings are synthesised once from the demo scenario into the
/// benchmark folder and reused.
/// </summary>
public static class BatchBenchmarks
{
    private static readonly string s_folder = Path.Combine(Formats.BenchmarkRecordings.Folder, "batch");

    /// <param name="oneThread">The beats stage on one thread (its per-core speed), instead of two.</param>
    public static void Run(bool skipFolder, bool oneThread = false)
    {
        var big = Recording72h();
        var days = skipFolder ? [] : EightDays();

        // A bare decode pass: every sample of the three leads in 1-min blocks, nothing else. Second pass timed (file cached).
        var decodeS = double.MaxValue;
        for (var i = 0; i < 2; i++)
        {
            var sw = Stopwatch.StartNew();
            DecodeAll(big);
            decodeS = Math.Min(decodeS, sw.Elapsed.TotalSeconds);
        }

        var samples = 3L * 72 * 3600 * 256;
        Line($"bare decode, 72 h 3-lead 256 Hz EDF+ ({samples / 1e6:F0} M samples): {decodeS:F2} s = {samples / decodeS / 1e6:F0} M samples/s");

        using var output = new TempOutput();
        var input = RecordingDiscovery.Find([big]).Single();
        ResetPeakMemory();
        var cpu0 = Process.GetCurrentProcess().TotalProcessorTime;
        var clock = Stopwatch.StartNew();
        var entry = BatchRunner.RunOne(input, output.Path, new BatchOptions { Force = true, Summary = new SummaryOptions { SecondBeatsThread = !oneThread } });
        var wholeS = clock.Elapsed.TotalSeconds;
        var cpuS = (Process.GetCurrentProcess().TotalProcessorTime - cpu0).TotalSeconds;
        var peakMb = PeakMemoryMb();
        if (entry.Status != BatchStatus.Done)
        {
            throw new InvalidOperationException(entry.Reason);
        }

        Line($"whole summary of it (fingerprint, beats, rhythm, episodes, outputs and the PDF), one recording{(oneThread ? ", beats on one thread" : "")}: {wholeS:F2} s wall ({cpuS:F2} s of process CPU), {wholeS / decodeS:F1}× the bare decode pass; peak resident memory {peakMb:F0} MB");
        Line($"  {entry.Summary!.Beats} beats; stages: {entry.Timings}");
        var fingerprintS = Time(() => RecordingFingerprint.Compute(input, new SummaryOptions()));
        Line($"  of which the fingerprint (SHA-256 of {new FileInfo(big).Length / 1048576.0:F0} MB and its side files): {fingerprintS:F2} s");

        if (days.Count > 0)
        {
            using var dayOutput = new TempOutput();
            var inputs = RecordingDiscovery.Find([Path.GetDirectoryName(days[0])!]);
            ResetPeakMemory();
            clock.Restart();
            var result = BatchRunner.Run(inputs, dayOutput.Path, new BatchOptions { Jobs = 2, Force = true });
            var batchS = clock.Elapsed.TotalSeconds;
            Line($"folder of {inputs.Count} recordings of 24 h (2-lead 250 Hz), --jobs 2: {batchS:F1} s wall ({result.Done} done, {result.Failed} failed); peak resident memory {PeakMemoryMb():F0} MB");
            Line($"  summed stages: {result.TotalTimings()}");
            clock.Restart();
            BatchRunner.Run(inputs, dayOutput.Path, new BatchOptions { Jobs = 2 });
            Line($"  the same folder again, every recording unchanged (fingerprints only): {clock.Elapsed.TotalSeconds:F1} s");
        }

        MachineLine();
    }

    /// <summary>
    /// The beats stage alone over the 72 h recording, on one thread, four times in this process: its per-core speed
    /// with nothing else sharing the machine (the whole-summary run above hashes the fingerprint, compiles and writes
    /// beside it). The first pass includes the runtime's start-up compilation (run it in a fresh process); the other
    /// three are the steady state a batch of recordings runs in, and their median is the figure (as a benchmark
    /// harness measures after its warm-up), printed beside the first pass and the range.
    /// </summary>
    public static void BeatsStageAlone()
    {
        const int passes = 4;
        var big = Recording72h();
        var warm = new List<double>();
        var first = 0.0;
        for (var pass = 1; pass <= passes; pass++)
        {
            using var reader = RecordingOpener.Open(big);
            var channels = LongRecord.Pipeline.Channels.EcgChannelSelector.Select(reader.Info);
            var cpu0 = Process.GetCurrentProcess().TotalProcessorTime;
            var clock = Stopwatch.StartNew();
            var analyser = RecordingSummariser.DetectBeats(reader, channels, new SummaryOptions().BlockSamples, secondThread: false);
            var wallS = clock.Elapsed.TotalSeconds;
            var cpuS = (Process.GetCurrentProcess().TotalProcessorTime - cpu0).TotalSeconds;
            var samples = (double)channels.SampleCount * channels.Indices.Length;
            var speed = samples / wallS / 1e6;
            if (pass == 1)
            {
                first = speed;
            }
            else
            {
                warm.Add(speed);
            }

            Line($"beats stage alone, 72 h 3-lead 256 Hz, one thread, pass {pass}{(pass == 1 ? " (fresh process: start-up compilation included)" : "")}: {wallS:F2} s wall = {speed:F1} M samples/s ({cpuS:F2} s of process CPU; {analyser.Beats.Count} beats; {analyser.Timings})");
        }

        warm.Sort();
        Line($"beats stage alone, one thread: passes 2–{passes} median {warm[warm.Count / 2]:F1} M samples/s (range {warm[0]:F1}–{warm[^1]:F1}); first pass, start-up compilation included, {first:F1}");
        MachineLine();
    }

    private static void MachineLine() =>
        Line($"machine: {Environment.ProcessorCount} cores, load average {File.ReadAllText("/proc/loadavg").Split(' ')[0]} when finished");

    private static double Time(Action work)
    {
        var sw = Stopwatch.StartNew();
        work();
        return sw.Elapsed.TotalSeconds;
    }

    private static void DecodeAll(string path)
    {
        using var reader = RecordingOpener.Open(path);
        var n = reader.Info.Channels[0].SampleCount;
        int[] channels = [0, 1, 2];
        var block = 60 * 256;
        var buffer = new float[channels.Length * block];
        for (long s = 0; s < n; s += block)
        {
            var c = (int)Math.Min(block, n - s);
            reader.Read(channels, s, c, buffer.AsSpan(0, channels.Length * c));
        }
    }

    private static string Recording72h()
    {
        var path = Path.Combine(s_folder, "single", "holter-72h-3lead-256hz.edf");
        if (!File.Exists(path))
        {
            Directory.CreateDirectory(Path.GetDirectoryName(path)!);
            var scenario = DemoScenario() with
            {
                SamplingRateHz = 256,
                Leads = [new ScenarioLead("ECG1", LeadView.II), new ScenarioLead("ECG2", LeadView.V1), new ScenarioLead("ECG3", LeadView.V5)],
            };
            Write(scenario, 72, path);
        }

        return path;
    }

    private static IReadOnlyList<string> EightDays()
    {
        var paths = new List<string>();
        for (var i = 1; i <= 8; i++)
        {
            var path = Path.Combine(s_folder, "eight-days", $"day-{i}.edf");
            if (!File.Exists(path))
            {
                Directory.CreateDirectory(Path.GetDirectoryName(path)!);
                Write(DemoScenario() with { Seed = (ulong)(100 + i) }, 24, path);
            }

            paths.Add(path);
        }

        return paths;
    }

    private static void Write(Scenario scenario, double hours, string path)
    {
        Line($"synthesising {Path.GetFileName(path)} ({hours} h) once…");
        SyntheticRecordingExport.Write(SyntheticRecording.Create(scenario, new SynthesisOptions { Hours = hours }), path);
    }

    private static Scenario DemoScenario()
    {
        for (var d = new DirectoryInfo(AppContext.BaseDirectory); d is not null; d = d.Parent)
        {
            var p = Path.Combine(d.FullName, "fixtures", "scenarios", "demo-24h.json");
            if (File.Exists(p))
            {
                return ScenarioLoader.Load(p);
            }
        }

        throw new FileNotFoundException($"fixtures/scenarios/demo-24h.json not found above {AppContext.BaseDirectory}");
    }

    // Linux: writing 5 to clear_refs resets the peak resident set (VmHWM), so synthesis before it does not count.
    private static void ResetPeakMemory()
    {
        GC.Collect();
        GC.WaitForPendingFinalizers();
        GC.Collect();
        try
        {
            File.WriteAllText("/proc/self/clear_refs", "5");
        }
        catch (IOException)
        {
        }
        catch (UnauthorizedAccessException)
        {
        }
    }

    private static double PeakMemoryMb()
    {
        foreach (var line in File.ReadLines("/proc/self/status"))
        {
            if (line.StartsWith("VmHWM:", StringComparison.Ordinal))
            {
                return double.Parse(line[6..].Trim().Split(' ')[0], CultureInfo.InvariantCulture) / 1024;
            }
        }

        return Process.GetCurrentProcess().PeakWorkingSet64 / 1048576.0;
    }

    private static void Line(string text) => Console.WriteLine("benchmark batch: " + text);

    private sealed class TempOutput : IDisposable
    {
        public string Path { get; } = System.IO.Path.Combine(System.IO.Path.GetTempPath(), $"longrecord-bench-out-{Guid.NewGuid():N}");

        public void Dispose()
        {
            if (Directory.Exists(Path))
            {
                Directory.Delete(Path, recursive: true);
            }
        }
    }
}
