using LongRecord.Reporting.Model;

namespace LongRecord.Reporting.Tests.Support;

/// <summary>
/// A deterministic strip source for hand-built reports: two leads of a simple sum-of-Gaussians beat at 75 bpm (P, QRS,
/// T), 250 Hz, every beat labelled N except every seventh, labelled V.
/// </summary>
public sealed class SyntheticStrips : IStripSource
{
    public const double RateHz = 250;
    public const double RrS = 0.8;
    private readonly StripSignal _signal = new(2, 2600);

    public IReadOnlyList<string> LeadLabels { get; } = ["ECG1", "ECG2"];

    public int Reads { get; private set; }

    public StripSignal Read(double startS, double durationS)
    {
        Reads++;
        var count = (int)Math.Round(durationS * RateHz);
        _signal.Reset(startS, RateHz, count);
        for (var i = 0; i < count; i++)
        {
            var t = startS + i / RateHz;
            var phase = t % RrS;
            var v = Wave(phase, 0.16, 0.025, 0.15) + Wave(phase, 0.30, 0.012, 1.2) + Wave(phase, 0.55, 0.045, 0.3);
            _signal.Samples[i] = (float)v;
            _signal.Samples[count + i] = (float)(-0.6 * v + 0.1 * Wave(phase, 0.28, 0.01, 1));
        }

        for (var k = Math.Ceiling(startS / RrS); k * RrS < startS + durationS; k++)
        {
            _signal.Beats.Add(new StripBeat(k * RrS + 0.30, (long)k % 7 == 0 ? 'V' : 'N'));
        }

        return _signal;
    }

    private static double Wave(double t, double centre, double width, double mv) => mv * Math.Exp(-Math.Pow((t - centre) / width, 2));
}
