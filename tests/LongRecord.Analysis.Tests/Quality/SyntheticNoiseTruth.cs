using LongRecord.Analysis.Conditioning;
using LongRecord.Synthesis;

namespace LongRecord.Analysis.Tests.Quality;

/// <summary>
/// Per-window noise truth of a synthetic recording: the scripted noise rendered alone and conditioned like the signal,
/// against each lead's median clean QRS peak-to-peak — the synthesiser's own SNR definition (S = pp² ⁄ 8, N = mean
/// square of the noise; fixtures/scenarios/README.md) applied per one-second window after conditioning.
/// </summary>
internal sealed class SyntheticNoiseTruth
{
    private SyntheticNoiseTruth(double[][] snrDb, float[][] signal, double samplingRateHz)
    {
        SnrDb = snrDb;
        Signal = signal;
        SamplingRateHz = samplingRateHz;
    }

    /// <summary>Local SNR in dB per lead and window (+∞ where no noise was added).</summary>
    public double[][] SnrDb { get; }

    /// <summary>The full signal of the rendered stretch, one array per lead.</summary>
    public float[][] Signal { get; }

    public double SamplingRateHz { get; }

    public static SyntheticNoiseTruth Of(SyntheticRecording recording, long start, int count)
    {
        var fs = recording.SamplingRateHz;
        var leads = recording.Leads.Count;
        float[][] Lanes(SignalComponents c)
        {
            var block = new float[leads * count];
            recording.Render(start, count, block, c);
            return Enumerable.Range(0, leads).Select(k => block.AsSpan(k * count, count).ToArray()).ToArray();
        }

        var noise = Lanes(SignalComponents.NoiseStretches);
        var clean = Lanes(SignalComponents.Ecg);
        var all = Lanes(SignalComponents.All);
        var half = (int)Math.Round(0.06 * fs);
        var windows = (int)Math.Ceiling(count / fs);
        var snr = new double[leads][];
        for (var k = 0; k < leads; k++)
        {
            var amplitudes = new List<double>();
            foreach (var beat in recording.Truth.Beats)
            {
                var r = beat.RSample - start;
                if (r - half < 0 || r + half >= count)
                {
                    continue;
                }

                var lane = clean[k].AsSpan((int)(r - half), 2 * half + 1);
                amplitudes.Add(lane.ToArray().Max() - lane.ToArray().Min());
            }

            amplitudes.Sort();
            var pp = amplitudes[amplitudes.Count / 2];
            var conditioned = (float[])noise[k].Clone();
            new EcgConditioner(fs).Process(conditioned);
            snr[k] = new double[windows];
            for (var w = 0; w < windows; w++)
            {
                int a = (int)Math.Round(w * fs), b = Math.Min(count, (int)Math.Round((w + 1) * fs));
                double sum = 0;
                var touched = false;
                for (var i = a; i < b; i++)
                {
                    sum += (double)conditioned[i] * conditioned[i];
                    touched |= noise[k][i] != 0;
                }

                snr[k][w] = touched ? 10 * Math.Log10(pp * pp / 8 / Math.Max(sum / (b - a), 1e-30)) : double.PositiveInfinity;
            }
        }

        return new SyntheticNoiseTruth(snr, all, fs);
    }
}
