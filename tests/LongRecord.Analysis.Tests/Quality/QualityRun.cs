using LongRecord.Analysis.Conditioning;
using LongRecord.Analysis.Quality;
using LongRecord.Analysis.Tests.Support;
using LongRecord.Formats.Wfdb;
using LongRecord.Synthesis;
using LongRecord.Synthesis.Scenarios;
using LongRecord.TestSupport;

namespace LongRecord.Analysis.Tests.Quality;

/// <summary>Runs the monitor the way the pipeline will: conditioning per lead, streaming in blocks, raw and conditioned lead-major.</summary>
internal static class QualityRun
{
    public static List<QualityWindow> Windows(float[][] leads, double samplingRateHz, QualitySettings? settings = null, int blockSamples = 4096)
    {
        var n = leads[0].Length;
        var count = leads.Length;
        var monitor = new SignalQualityMonitor(samplingRateHz, count, settings);
        var conditioners = leads.Select(_ => new EcgConditioner(samplingRateHz)).ToArray();
        var raw = new float[count * blockSamples];
        var conditioned = new float[count * blockSamples];
        var windows = new List<QualityWindow>();
        for (var start = 0; start < n; start += blockSamples)
        {
            var c = Math.Min(blockSamples, n - start);
            for (var k = 0; k < count; k++)
            {
                leads[k].AsSpan(start, c).CopyTo(raw.AsSpan(k * c, c));
                leads[k].AsSpan(start, c).CopyTo(conditioned.AsSpan(k * c, c));
                conditioners[k].Process(conditioned.AsSpan(k * c, c));
            }

            monitor.Process(raw.AsSpan(0, count * c), conditioned.AsSpan(0, count * c), c);
            windows.AddRange(monitor.Finished);
        }

        monitor.Flush();
        windows.AddRange(monitor.Finished);
        return windows;
    }

    /// <summary>The monitor over a PhysioNet record, with the rails its header declares (ADC range).</summary>
    public static List<QualityWindow> Windows(ReferenceRecord record) => Windows(record.Leads, record.SamplingRateHz, RailsOf(record));

    public static QualitySettings RailsOf(ReferenceRecord record)
    {
        using var reader = WfdbRecordReader.Open(SharedData.Path(Path.Combine("physionet", record.Database, record.Name + ".hea")));
        var channels = reader.Info.Channels;
        return new QualitySettings
        {
            RailLowMv = channels.Select(c => (c.DigitalMin - c.Baseline) / c.Gain * (c.IsVoltage ? c.MillivoltsPerUnit : 1)).ToArray(),
            RailHighMv = channels.Select(c => (c.DigitalMax - c.Baseline) / c.Gain * (c.IsVoltage ? c.MillivoltsPerUnit : 1)).ToArray(),
        };
    }

    /// <summary>Every lead of a rendered synthetic recording, one array per lead.</summary>
    public static float[][] Render(SyntheticRecording recording, SignalComponents components = SignalComponents.All)
    {
        var n = (int)recording.SampleCount;
        var count = recording.Leads.Count;
        var block = new float[count * n];
        recording.Render(0, n, block, components);
        return Enumerable.Range(0, count).Select(k => block.AsSpan(k * n, n).ToArray()).ToArray();
    }

    public static SyntheticRecording Scenario(string name, double? hours = null) =>
        SyntheticRecording.Create(ScenarioLoader.Load(ScenarioPath(name)), new SynthesisOptions { Hours = hours });

    private static string ScenarioPath(string name)
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "fixtures", "scenarios", name + ".json");
            if (File.Exists(candidate))
            {
                return candidate;
            }
        }

        throw new FileNotFoundException($"fixtures/scenarios/{name}.json not found above {AppContext.BaseDirectory}");
    }

    /// <summary>Window index holding sample <paramref name="sample"/> (windows are whole seconds).</summary>
    public static int WindowOf(long sample, double samplingRateHz) => (int)Math.Floor(sample / samplingRateHz);
}
