using LongRecord.Synthesis.Model;
using LongRecord.Synthesis.Timeline;

namespace LongRecord.Synthesis.Rendering;

/// <summary>
/// Adds the P, QRS and T Gaussians of every scheduled complex that reaches into a block. Each sample's value depends
/// only on its index (the contributions are added in schedule order), so any block split gives the same samples.
/// </summary>
internal sealed class BeatRenderer(Complex[] complexes, WaveTable waves, LeadMorphologies morph, double samplingRateHz)
{
    /// <summary>Gaussians are cut at ±5 widths (relative level 4e-6).</summary>
    private const double CutWidths = 5.0;

    /// <summary>Furthest any wave reaches after / before its complex's anchor time (T of a slow broad beat; P before R).</summary>
    private const double ReachAfterS = 1.0;
    private const double ReachBeforeS = 0.5;

    public void Render(long start, int count, int leads, Span<float> destination)
    {
        var t0 = start / samplingRateHz;
        var t1 = (start + count) / samplingRateHz;
        for (var i = FirstAnchorAtOrAfter(t0 - ReachAfterS); i < complexes.Length && complexes[i].AnchorS <= t1 + ReachBeforeS; i++)
        {
            ref readonly var c = ref complexes[i];
            if (c.IsBeat)
            {
                var rCentre = c.RTimeS - morph.FiducialShiftS[c.Morph];
                foreach (var w in waves.Qrs[c.Morph])
                {
                    Add(rCentre + w.CenterS, w.WidthS, w.AmplitudeMv, c.QrsScale, start, count, leads, destination);
                }

                var s = WaveCatalogue.TScale(c.RrS);
                foreach (var w in waves.T[c.Morph])
                {
                    Add(rCentre + w.CenterS * s, w.WidthS * s, w.AmplitudeMv, c.QrsScale, start, count, leads, destination);
                }
            }

            if (!double.IsNaN(c.PTimeS))
            {
                foreach (var w in waves.P[c.PShape])
                {
                    Add(c.PTimeS + w.CenterS, w.WidthS, w.AmplitudeMv, c.PScale, start, count, leads, destination);
                }
            }
        }
    }

    private int FirstAnchorAtOrAfter(double tS)
    {
        int lo = 0, hi = complexes.Length;
        while (lo < hi)
        {
            var mid = (lo + hi) >>> 1;
            if (complexes[mid].AnchorS < tS)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }

        return lo;
    }

    private void Add(double centreS, double widthS, double[] amplitudeMv, float scale, long start, int count, int leads, Span<float> destination)
    {
        var first = Math.Max(start, (long)Math.Ceiling((centreS - CutWidths * widthS) * samplingRateHz));
        var last = Math.Min(start + count - 1, (long)Math.Floor((centreS + CutWidths * widthS) * samplingRateHz));
        var inv = 1.0 / widthS;
        for (var n = first; n <= last; n++)
        {
            var d = (n / samplingRateHz - centreS) * inv;
            var g = scale * Math.Exp(-0.5 * d * d);
            var offset = (int)(n - start);
            for (var k = 0; k < leads; k++)
            {
                destination[k * count + offset] += (float)(amplitudeMv[k] * g);
            }
        }
    }
}
