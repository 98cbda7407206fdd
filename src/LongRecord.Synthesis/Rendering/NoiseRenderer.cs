using System.Buffers;
using LongRecord.Synthesis.Randomness;
using LongRecord.Synthesis.Scenarios;

namespace LongRecord.Synthesis.Rendering;

/// <summary>Adds background noise and noise stretches to a block, then applies lead-off stretches over everything.</summary>
internal sealed class NoiseRenderer(NoiseSource[] sources, BackgroundNoise background, ulong seed, double samplingRateHz, int leads)
{
    // Nominal RMS of the unit baseline-wander generator (0.7 sine + 0.7 and 0.25 of value noise), measured, ours.
    private const double WanderRawRms = 0.83;

    public void AddBackground(long start, int count, Span<float> destination)
    {
        var wander = background.BaselineWanderMv / WanderRawRms;
        var muscle = background.MuscleNoiseMv / Math.Sqrt(1.25);
        if (wander == 0 && muscle == 0)
        {
            return;
        }

        var f = 0.2 + 0.1 * CounterRandom.Uniform(seed, 60, 0);
        for (var k = 0; k < leads; k++)
        {
            var slow = new ValueNoiseCursor(seed, 61 + (ulong)k);
            var fast = new ValueNoiseCursor(seed, 64 + (ulong)k);
            var phase = 2 * Math.PI * CounterRandom.Uniform(seed, 67, k);
            var lane = destination.Slice(k * count, count);
            for (var i = 0; i < count; i++)
            {
                var n = start + i;
                var t = n / samplingRateHz;
                var v = 0.0;
                if (wander != 0)
                {
                    v += wander * (0.7 * Math.Sin(2 * Math.PI * f * t + phase) + 0.7 * slow.At(t / 2.0) + 0.25 * fast.At(t / 0.7));
                }

                if (muscle != 0)
                {
                    v += muscle * (CounterRandom.NearGaussian(seed, 70 + (ulong)k, n) + 0.5 * CounterRandom.NearGaussian(seed, 70 + (ulong)k, n - 1));
                }

                lane[i] += (float)v;
            }
        }
    }

    public void AddStretches(long start, int count, Span<float> destination)
    {
        var end = start + count;
        double[]? rented = null;
        try
        {
            foreach (var s in sources)
            {
                if (s.Kind == NoiseKind.LeadOff || s.EndSample <= start || s.StartSample >= end)
                {
                    continue;
                }

                var n0 = Math.Max(start, s.StartSample);
                var n1 = Math.Min(end, s.EndSample);
                rented ??= ArrayPool<double>.Shared.Rent(count);
                var raw = rented.AsSpan(0, (int)(n1 - n0));
                for (var k = 0; k < leads; k++)
                {
                    if (!s.LeadMask[k])
                    {
                        continue;
                    }

                    s.Raw(k, n0, raw);
                    var lane = destination.Slice(k * count, count);
                    var g = s.Gain[k];
                    for (var i = 0; i < raw.Length; i++)
                    {
                        lane[(int)(n0 - start) + i] += (float)(g * raw[i]);
                    }
                }
            }
        }
        finally
        {
            if (rented is not null)
            {
                ArrayPool<double>.Shared.Return(rented);
            }
        }
    }

    public void ApplyLeadOff(long start, int count, Span<float> destination)
    {
        var end = start + count;
        foreach (var s in sources)
        {
            if (s.Kind != NoiseKind.LeadOff || s.EndSample <= start || s.StartSample >= end)
            {
                continue;
            }

            var stretch = s.Placed.Stretch;
            var value = stretch.Mode switch
            {
                LeadOffMode.RailHigh => (float)stretch.RailMv,
                LeadOffMode.RailLow => (float)-stretch.RailMv,
                _ => 0f,
            };
            var n0 = (int)(Math.Max(start, s.StartSample) - start);
            var n1 = (int)(Math.Min(end, s.EndSample) - start);
            for (var k = 0; k < leads; k++)
            {
                if (s.LeadMask[k])
                {
                    destination.Slice(k * count + n0, n1 - n0).Fill(value);
                }
            }
        }
    }
}
