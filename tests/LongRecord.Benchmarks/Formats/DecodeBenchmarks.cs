using BenchmarkDotNet.Attributes;
using LongRecord.Formats;

namespace LongRecord.Benchmarks.Formats;

/// <summary>
/// Decoding a 24 h two-lead 250 Hz recording (43.2 M samples) to float through the multi-channel block read, in
/// 1-minute blocks, on one thread. Target (foundation issue): ≥ 150 M samples/s for EDF+ and WFDB format 212.
/// </summary>
[MemoryDiagnoser]
public class DecodeBenchmarks
{
    private const int BlockSamples = 60 * 250;
    private readonly float[] _buffer = new float[2 * BlockSamples];
    private string _edf = "";
    private string _wfdb = "";

    [GlobalSetup]
    public void Setup()
    {
        _edf = BenchmarkRecordings.Edf(24);
        _wfdb = BenchmarkRecordings.Wfdb212(24);
    }

    [Benchmark]
    public double Edf24h() => DecodeAll(_edf, _buffer);

    [Benchmark]
    public double Wfdb212_24h() => DecodeAll(_wfdb, _buffer);

    /// <summary>Reads every sample of both leads; returns a checksum so the work cannot be skipped.</summary>
    public static double DecodeAll(string path, float[] buffer)
    {
        using var reader = RecordingOpener.Open(path);
        var n = reader.Info.Channels[0].SampleCount;
        var count = buffer.Length / 2;
        double sum = 0;
        for (long s = 0; s < n; s += count)
        {
            var c = (int)Math.Min(count, n - s);
            reader.Read([0, 1], s, c, buffer);
            sum += buffer[0] + buffer[c];
        }

        return sum;
    }
}
