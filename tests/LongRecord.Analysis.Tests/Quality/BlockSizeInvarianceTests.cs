using LongRecord.Analysis.Conditioning;
using LongRecord.Analysis.Quality;
using LongRecord.Analysis.Tests.Support;

namespace LongRecord.Analysis.Tests.Quality;

/// <summary>The same windows and stretches for any way of cutting the input into blocks.</summary>
public sealed class BlockSizeInvarianceTests
{
    [Fact]
    public void Mitdb207FirstFiveMinutes_AnyBlockSizes_SameWindows()
    {
        // 0–300 s of record 207 hold noise, bundle-branch block, VT and four flutter stretches.
        var record = ReferenceRecord.Load("mitdb", "207");
        var n = (int)(300 * record.SamplingRateHz);
        var raw = record.Leads.Select(l => l.AsSpan(0, n).ToArray()).ToArray();
        AssertInvariant(raw, record.SamplingRateHz, QualityRun.RailsOf(record));
    }

    [Fact]
    public void LeadOffAndFibrillationScenarios_AnyBlockSizes_SameWindows()
    {
        foreach (var name in new[] { "lead-off", "vf-vfl" })
        {
            var recording = QualityRun.Scenario(name);
            var raw = QualityRun.Render(recording);
            // Missing samples too: a gap on ECG1 and one on both leads.
            raw[0].AsSpan(1000, 3000).Fill(float.NaN);
            raw[0].AsSpan(9000, 500).Fill(float.NaN);
            raw[1].AsSpan(9000, 500).Fill(float.NaN);
            AssertInvariant(raw, recording.SamplingRateHz, new QualitySettings { RailLowMv = [-5.0, -5.0], RailHighMv = [5.0, 5.0] });
        }
    }

    private static void AssertInvariant(float[][] raw, double fs, QualitySettings settings)
    {
        var conditioned = raw.Select(l =>
        {
            var c = (float[])l.Clone();
            new EcgConditioner(fs).Process(c);
            return c;
        }).ToArray();
        var reference = Run(raw, conditioned, fs, settings, _ => raw[0].Length);
        Assert.True(reference.Windows.Count >= raw[0].Length / fs);
        var random = new Random(12345);
        foreach (Func<int, int> size in new Func<int, int>[] { _ => 1, _ => 7, _ => 360, _ => 4096, _ => random.Next(1, 5000) })
        {
            var other = Run(raw, conditioned, fs, settings, size);
            Assert.Equal(reference.Windows.Count, other.Windows.Count);
            for (var i = 0; i < reference.Windows.Count; i++)
            {
                var a = reference.Windows[i];
                var b = other.Windows[i];
                Assert.Equal((a.Index, a.StartSample, a.EndSample, a.Reason), (b.Index, b.StartSample, b.EndSample, b.Reason));
                for (var k = 0; k < a.LeadCount; k++)
                {
                    Assert.Equal(a.State(k), b.State(k));
                }
            }

            Assert.Equal(reference.Stretches, other.Stretches);
        }
    }

    private static (List<QualityWindow> Windows, List<QualityStretch> Stretches) Run(float[][] raw, float[][] conditioned, double fs, QualitySettings settings, Func<int, int> blockSize)
    {
        var leads = raw.Length;
        var n = raw[0].Length;
        var monitor = new SignalQualityMonitor(fs, leads, settings);
        var windows = new List<QualityWindow>();
        var r = new float[leads * n];
        var c = new float[leads * n];
        for (var start = 0; start < n;)
        {
            var count = Math.Min(blockSize(start), n - start);
            for (var k = 0; k < leads; k++)
            {
                raw[k].AsSpan(start, count).CopyTo(r.AsSpan(k * count, count));
                conditioned[k].AsSpan(start, count).CopyTo(c.AsSpan(k * count, count));
            }

            monitor.Process(r.AsSpan(0, leads * count), c.AsSpan(0, leads * count), count);
            windows.AddRange(monitor.Finished);
            start += count;
        }

        monitor.Flush();
        windows.AddRange(monitor.Finished);
        return (windows, monitor.Stretches.ToList());
    }
}
