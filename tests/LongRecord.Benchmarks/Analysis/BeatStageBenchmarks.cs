using BenchmarkDotNet.Attributes;
using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Conditioning;
using LongRecord.Analysis.Quality;
using LongRecord.Formats;
using LongRecord.Pipeline.Channels;

namespace LongRecord.Benchmarks.Analysis;

/// <summary>
/// The beats stage's parts one by one — conditioning (lead by lead and as a lead set), signal quality and QRS
/// detection — over the 2 h two-lead 250 Hz demo held in memory in one-second steps (as <see cref="BeatAnalyser"/>
/// feeds them), so each figure is the stage alone without reading or the other stages. Multiply by 12 for a day.
/// </summary>
[MemoryDiagnoser]
public class BeatStageBenchmarks
{
    private float[][] _raw = [];
    private float[][] _conditioned = [];
    private float[] _work = [];
    private double _fs;
    private int _leads;
    private int _step;

    [GlobalSetup]
    public void Setup()
    {
        using var reader = RecordingOpener.Open(BeatRecordings.DemoDay(2));
        var channels = EcgChannelSelector.Select(reader.Info);
        _fs = channels.ReferenceRateHz;
        _leads = channels.Indices.Length;
        _step = (int)Math.Round(_fs);
        var steps = (int)(channels.SampleCount / _step);
        _raw = new float[steps][];
        _conditioned = new float[steps][];
        var conditioner = new LeadSetConditioner(_fs, _leads);
        for (var s = 0; s < steps; s++)
        {
            _raw[s] = new float[_leads * _step];
            reader.Read(channels.Indices, (long)s * _step, _step, _raw[s]);
            _conditioned[s] = (float[])_raw[s].Clone();
            conditioner.Process(_conditioned[s], _step);
        }

        _work = new float[_leads * _step];
    }

    [Benchmark]
    public float ConditionLeadByLead2h()
    {
        var conditioners = Enumerable.Range(0, _leads).Select(_ => new EcgConditioner(_fs)).ToArray();
        foreach (var block in _raw)
        {
            block.CopyTo(_work, 0);
            for (var k = 0; k < _leads; k++)
            {
                conditioners[k].Process(_work.AsSpan(k * _step, _step));
            }
        }

        return _work[0];
    }

    [Benchmark]
    public float ConditionLeadSet2h()
    {
        var conditioner = new LeadSetConditioner(_fs, _leads);
        foreach (var block in _raw)
        {
            block.CopyTo(_work, 0);
            conditioner.Process(_work, _step);
        }

        return _work[0];
    }

    [Benchmark]
    public int Quality2h()
    {
        var monitor = new SignalQualityMonitor(_fs, _leads);
        for (var s = 0; s < _raw.Length; s++)
        {
            monitor.Process(_raw[s], _conditioned[s], _step);
        }

        monitor.Flush();
        return monitor.Stretches.Count;
    }

    [Benchmark]
    public int Detection2h()
    {
        var detector = new QrsDetector(_fs, _leads);
        var detections = new List<long>();
        foreach (var block in _conditioned)
        {
            detector.Process(block, _step);
            detector.TakeDetections(detections);
        }

        detector.Flush();
        detector.TakeDetections(detections);
        return detections.Count;
    }
}
