using LongRecord.Synthesis.Randomness;
using LongRecord.Synthesis.Scenarios;
using LongRecord.Synthesis.Timeline;

namespace LongRecord.Synthesis.Rendering;

/// <summary>
/// One placed noise stretch ready to render: its unit-level ("raw") generator, the per-lead gains that give the
/// scripted SNR, and its sample range. Raw values are pure functions of (seed, lead, sample), so blocks agree.
/// </summary>
internal sealed class NoiseSource
{
    private const double TaperS = 0.2;
    private readonly MotionEvent[] _events;

    public NoiseSource(PlacedNoise placed, ulong seed, double samplingRateHz, long sampleCount, bool[] leadMask)
    {
        Placed = placed;
        Seed = seed;
        SamplingRateHz = samplingRateHz;
        StartSample = (long)Math.Ceiling(placed.StartS * samplingRateHz);
        EndSample = Math.Min(sampleCount, (long)Math.Ceiling(placed.EndS * samplingRateHz));
        LeadMask = leadMask;
        Gain = new double[leadMask.Length];
        _events = placed.Stretch.Kind == NoiseKind.ElectrodeMotion ? ElectrodeMotion.Draw(seed, placed.StartS, placed.EndS) : [];
    }

    public PlacedNoise Placed { get; }
    public ulong Seed { get; }
    public double SamplingRateHz { get; }
    public long StartSample { get; }

    /// <summary>One past the last sample.</summary>
    public long EndSample { get; }

    public bool[] LeadMask { get; }

    /// <summary>Per-lead gain applied to the raw generator (set by calibration).</summary>
    public double[] Gain { get; }

    public NoiseKind Kind => Placed.Stretch.Kind;

    /// <summary>Writes the tapered raw noise of <paramref name="lead"/> for samples n0 … n0 + raw.Length − 1 (all inside the stretch).</summary>
    public void Raw(int lead, long n0, Span<double> raw)
    {
        var fs = SamplingRateHz;
        var s = Seed;
        var l = (ulong)lead;
        switch (Kind)
        {
            case NoiseKind.BaselineWander:
            {
                var slow = new ValueNoiseCursor(s, 10 + l);
                var fast = new ValueNoiseCursor(s, 20 + l);
                var f = 0.15 + 0.2 * CounterRandom.Uniform(s, 1, 0);
                var phase = 2 * Math.PI * CounterRandom.Uniform(s, 2, lead);
                for (var i = 0; i < raw.Length; i++)
                {
                    var t = (n0 + i) / fs;
                    raw[i] = 0.7 * Math.Sin(2 * Math.PI * f * t + phase) + 0.7 * slow.At(t / 2.0) + 0.25 * fast.At(t / 0.7);
                }

                break;
            }

            case NoiseKind.Muscle:
            {
                var envelope = new ValueNoiseCursor(s, 30 + l);
                for (var i = 0; i < raw.Length; i++)
                {
                    var n = n0 + i;
                    var t = n / fs;
                    var g = CounterRandom.NearGaussian(s, 40 + l, n) + 0.5 * CounterRandom.NearGaussian(s, 40 + l, n - 1);
                    raw[i] = (0.75 + 0.25 * envelope.At(t / 0.4)) * g;
                }

                break;
            }

            default:
            {
                var drift = new ValueNoiseCursor(s, 50 + l);
                for (var i = 0; i < raw.Length; i++)
                {
                    raw[i] = 0.3 * drift.At((n0 + i) / fs / 1.5);
                }

                AddEvents(lead, n0, raw);
                break;
            }
        }

        for (var i = 0; i < raw.Length; i++)
        {
            raw[i] *= Taper((n0 + i) / fs);
        }
    }

    private void AddEvents(int lead, long n0, Span<double> raw)
    {
        var fs = SamplingRateHz;
        var t0 = n0 / fs;
        var t1 = (n0 + raw.Length) / fs;
        int lo = 0, hi = _events.Length;
        while (lo < hi)
        {
            var mid = (lo + hi) >>> 1;
            if (_events[mid].FromS < t0 - 10.0)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }

        for (var e = lo; e < _events.Length && _events[e].FromS <= t1; e++)
        {
            var ev = _events[e];
            var w = ev.Weight(lead);
            var first = Math.Max(n0, (long)Math.Ceiling(ev.FromS * fs));
            var last = Math.Min(n0 + raw.Length - 1, (long)Math.Floor(ev.ToS * fs));
            for (var n = first; n <= last; n++)
            {
                raw[(int)(n - n0)] += w * ev.Value(n / fs);
            }
        }
    }

    private double Taper(double t)
    {
        var edge = Math.Min(t - Placed.StartS, Placed.EndS - t);
        return edge >= TaperS ? 1.0 : 0.5 - 0.5 * Math.Cos(Math.PI * Math.Max(0, edge) / TaperS);
    }
}
