using LongRecord.Synthesis.Model;
using LongRecord.Synthesis.Scenarios;
using LongRecord.Synthesis.Truth;

namespace LongRecord.Synthesis.Timeline;

/// <summary>Ventricular rhythms: broad-complex tachycardia, ventricular flutter and fibrillation.</summary>
internal sealed partial class BeatScheduler
{
    private void RunBroadComplexTachycardia(PlacedSegment p)
    {
        var seg = p.Segment;
        var rate = seg.RateBpm ?? 170;
        var dissociation = seg.AvDissociation ?? true;
        var atrialRate = seg.AtrialRateBpm ?? 80;
        var endPause = seg.EndPauseS ?? 1.2;
        var morph = ParseMorph(seg.Morphology, WaveCatalogue.VentricularTachycardia);
        var d = Open(p, RhythmNames.Name(seg.Rhythm), RhythmLabels.VentricularTachycardia, OnsetType.Abrupt, OnsetType.Abrupt);
        d.Parameters["rateBpm"] = rate;
        d.Parameters["avDissociation"] = dissociation ? 1 : 0;
        d.Parameters["endPauseS"] = endPause;
        d.Settings["morphology"] = WaveCatalogue.Morphologies[morph].Name;

        var rrT = 60.0 / rate;
        var r = Math.Max(p.StartS, LastROr(p.StartS) + Math.Max(0.6 * _lastRr, 0.95 * rrT));
        var first = r;
        while (r < p.EndS)
        {
            Beat(r, BeatClass.V, morph, WaveCatalogue.PNone, double.NaN);
            r += rrT * (1 + 0.008 * _rng.NextGaussian());
        }

        if (dissociation)
        {
            // The sinus node keeps its own rate; its P waves fall anywhere relative to the QRS (AV dissociation).
            d.Parameters["atrialRateBpm"] = atrialRate;
            for (var pt = first + _rng.Uniform(0.05, 60.0 / atrialRate); pt < LastROr(p.EndS); pt += 60.0 / atrialRate * (1 + 0.02 * _rng.NextGaussian()))
            {
                LoneP(pt, Complex.ClassDissociatedP, WaveCatalogue.PSinus);
            }
        }

        Close(d);
        var last = LastROr(p.EndS);
        ResumeSinusAt(last + Math.Max(endPause, SinusRrAt(last)));
    }

    private void RunVentricularWaves(PlacedSegment p)
    {
        var seg = p.Segment;
        var flutter = seg.Rhythm == RhythmKind.VentricularFlutter;
        var rate = seg.RateBpm ?? 280;
        var d = Open(p, RhythmNames.Name(seg.Rhythm), flutter ? RhythmLabels.VentricularFlutter : RhythmLabels.VentricularFibrillation, OnsetType.Abrupt, OnsetType.Abrupt);
        d.FixedStartS = p.StartS;
        d.FixedEndS = p.EndS;
        if (flutter)
        {
            d.Parameters["rateBpm"] = rate;
        }

        _sources.Add(new ContinuousSource(flutter ? ContinuousKind.VentricularFlutter : ContinuousKind.VentricularFibrillation, p.StartS, p.EndS, _rng.NextSeed(), flutter ? rate / 60.0 : 5.0, 1.0, p.StartS));
        Close(d);
        _lastR = double.NaN;
        _lastRr = 1.0;
        ResumeSinusAt(p.EndS + 0.8);
    }
}
