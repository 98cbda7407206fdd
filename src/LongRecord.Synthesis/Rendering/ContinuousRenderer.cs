using LongRecord.Synthesis.Model;
using LongRecord.Synthesis.Randomness;
using LongRecord.Synthesis.Timeline;

namespace LongRecord.Synthesis.Rendering;

/// <summary>
/// Renders the activity that is not beat-locked: flutter sawtooth, fibrillatory waves, ventricular flutter and
/// fibrillation. Every value is a closed-form function of time (phases are integrated analytically), so blocks agree.
/// Waveforms and rates are ours: flutter a rounded sawtooth (fast 25 % rise, slow 75 % fall); f waves at 6 Hz
/// wandering ±1.6 Hz with an irregular envelope; ventricular flutter a near-sine; fibrillation two incoherent
/// components of wandering frequency (3–7 Hz) and amplitude.
/// </summary>
internal sealed class ContinuousRenderer(ContinuousSource[] sources, IReadOnlyList<LeadView> views, double samplingRateHz)
{
    private const double TaperS = 0.15;

    public void Render(long start, int count, Span<float> destination)
    {
        var leads = views.Count;
        var t0 = start / samplingRateHz;
        var t1 = (start + count) / samplingRateHz;
        foreach (var src in sources)
        {
            if (src.EndS <= t0 || src.StartS >= t1)
            {
                continue;
            }

            var amp = new double[leads];
            var mix = new double[leads];
            for (var k = 0; k < leads; k++)
            {
                amp[k] = src.Scale * (src.Kind switch
                {
                    ContinuousKind.FlutterWaves => WaveCatalogue.FlutterWave,
                    ContinuousKind.FibrillatoryWaves => WaveCatalogue.FibrillatoryWave,
                    _ => WaveCatalogue.VentricularWave,
                }).For(views[k]);
                mix[k] = 0.4 + 0.6 * CounterRandom.Uniform(src.Seed, 90, k);
            }

            var envelope2 = new ValueNoiseCursor(src.Seed, 2);
            var envelope3 = new ValueNoiseCursor(src.Seed, 3);
            var envelope4 = new ValueNoiseCursor(src.Seed, 4);
            var envelope5 = new ValueNoiseCursor(src.Seed, 5);
            var first = Math.Max(start, (long)Math.Ceiling(src.StartS * samplingRateHz));
            var last = Math.Min(start + count - 1, (long)Math.Ceiling(src.EndS * samplingRateHz) - 1);
            for (var n = first; n <= last; n++)
            {
                var t = n / samplingRateHz;
                var taper = Taper(t, src.StartS, src.EndS);
                var offset = (int)(n - start);
                switch (src.Kind)
                {
                    case ContinuousKind.FlutterWaves:
                    {
                        var v = taper * Sawtooth((t - src.PhaseOriginS) * src.RateHz);
                        for (var k = 0; k < leads; k++)
                        {
                            destination[k * count + offset] += (float)(amp[k] * v);
                        }

                        break;
                    }

                    case ContinuousKind.FibrillatoryWaves:
                    {
                        var phase = WanderingPhase(src, t, 1.0, 0.6);
                        var envelope = Math.Max(0.15, 1 + 0.45 * envelope2.At(t / 0.8));
                        var v = taper * envelope * (Math.Sin(phase) + 0.35 * Math.Sin(2 * phase + 0.7)) / 1.06;
                        for (var k = 0; k < leads; k++)
                        {
                            destination[k * count + offset] += (float)(amp[k] * v);
                        }

                        break;
                    }

                    case ContinuousKind.VentricularFlutter:
                    {
                        var phase = 2 * Math.PI * src.RateHz * (t - src.StartS);
                        var envelope = 1 + 0.12 * envelope3.At(t / 2.0);
                        var v = taper * envelope * (Math.Sin(phase) + 0.15 * Math.Sin(2 * phase));
                        for (var k = 0; k < leads; k++)
                        {
                            destination[k * count + offset] += (float)(amp[k] * v);
                        }

                        break;
                    }

                    default:
                    {
                        var p1 = WanderingPhase(src, t, 1.5, 0.8);
                        var p2 = WanderingPhase(src with { RateHz = 3.5, Seed = src.Seed ^ 0xABCDUL }, t, 1.0, 0.5);
                        var a1 = Math.Max(0.05, 0.6 + 0.45 * envelope4.At(t / 0.6));
                        var a2 = Math.Max(0.05, 0.45 + 0.35 * envelope5.At(t / 0.9));
                        for (var k = 0; k < leads; k++)
                        {
                            var v = taper * (a1 * mix[k] * Math.Sin(p1) + a2 * (1.4 - mix[k]) * Math.Sin(p2 + k));
                            destination[k * count + offset] += (float)(amp[k] * v);
                        }

                        break;
                    }
                }
            }
        }
    }

    /// <summary>Unit peak-to-peak sawtooth, mean zero, with its sharp turn (minimum) at whole cycles.</summary>
    internal static double Sawtooth(double cycles)
    {
        var f = cycles - Math.Floor(cycles);
        var s = f < 0.25 ? 0.5 - 0.5 * Math.Cos(Math.PI * f / 0.25) : 1.0 - (f - 0.25) / 0.75;
        return s - 0.5;
    }

    // Phase of a carrier whose frequency is RateHz + a1 sin(2π m1 t + φ1) + a2 sin(2π m2 t + φ2), integrated exactly.
    private static double WanderingPhase(ContinuousSource src, double t, double a1, double a2)
    {
        var m1 = 0.09 + 0.05 * CounterRandom.Uniform(src.Seed, 20, 0);
        var m2 = 0.03 + 0.02 * CounterRandom.Uniform(src.Seed, 21, 0);
        var f1 = 2 * Math.PI * CounterRandom.Uniform(src.Seed, 22, 0);
        var f2 = 2 * Math.PI * CounterRandom.Uniform(src.Seed, 23, 0);
        return 2 * Math.PI * src.RateHz * (t - src.StartS)
            - a1 / m1 * Math.Cos(2 * Math.PI * m1 * t + f1)
            - a2 / m2 * Math.Cos(2 * Math.PI * m2 * t + f2);
    }

    private static double Taper(double t, double startS, double endS)
    {
        var edge = Math.Min(t - startS, endS - t);
        return edge >= TaperS ? 1.0 : 0.5 - 0.5 * Math.Cos(Math.PI * Math.Max(0, edge) / TaperS);
    }
}
