using LongRecord.Synthesis.Model;

namespace LongRecord.Synthesis.Rendering;

/// <summary>One Gaussian component with its amplitude already resolved for each lead of the recording.</summary>
internal readonly record struct LeadWave(double CenterS, double WidthS, double[] AmplitudeMv);

/// <summary>The catalogue's waves resolved for a recording's leads, ready for the render loop.</summary>
internal sealed class WaveTable
{
    public WaveTable(IReadOnlyList<LeadView> views)
    {
        Qrs = WaveCatalogue.Morphologies.Select(m => Resolve(m.Qrs, views)).ToArray();
        T = WaveCatalogue.Morphologies.Select(m => Resolve(m.T, views)).ToArray();
        P = WaveCatalogue.PShapes.Select(s => Resolve(s.Components, views)).ToArray();
    }

    public LeadWave[][] Qrs { get; }
    public LeadWave[][] T { get; }
    public LeadWave[][] P { get; }

    private static LeadWave[] Resolve(IReadOnlyList<GaussianWave> waves, IReadOnlyList<LeadView> views) =>
        waves.Select(w => new LeadWave(w.CenterS, w.WidthS, views.Select(v => w.Amplitude.For(v)).ToArray())).ToArray();
}
