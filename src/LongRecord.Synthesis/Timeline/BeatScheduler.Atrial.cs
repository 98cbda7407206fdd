using LongRecord.Synthesis.Model;
using LongRecord.Synthesis.Scenarios;
using LongRecord.Synthesis.Truth;

namespace LongRecord.Synthesis.Timeline;

/// <summary>Atrial tachyarrhythmias: focal and multifocal atrial tachycardia, PSVT, flutter, fibrillation.</summary>
internal sealed partial class BeatScheduler
{
    private void RunFocalAtrialTachycardia(PlacedSegment p)
    {
        var seg = p.Segment;
        var rate = seg.RateBpm ?? 160;
        var warm = seg.WarmUpBeats ?? 5;
        var shapeName = seg.PShape ?? "inverted";
        var shape = WaveCatalogue.PShapeByName(shapeName);
        var d = Open(p, RhythmNames.Name(seg.Rhythm), RhythmLabels.Svta, OnsetType.Abrupt, OnsetType.Abrupt);
        d.Parameters["rateBpm"] = rate;
        d.Parameters["warmUpBeats"] = warm;
        d.Settings["pShape"] = shapeName;

        var rrT = 60.0 / rate;
        var r = Math.Max(p.StartS, LastROr(p.StartS) + Math.Max(rrT * 1.35, 0.62 * _lastRr));
        for (var i = 1; r < p.EndS; i++)
        {
            var rr = double.IsNaN(_lastR) ? rrT : r - _lastR;
            // Ectopic PR lengthens a little at slow rates: P peak 120…160 ms before the R centre (ours).
            Beat(r, BeatClass.S, WaveCatalogue.Normal, shape, RCentre(r, WaveCatalogue.Normal) - (0.11 + 0.05 * Math.Min(rr, 1.0)));
            var warming = warm > 0 ? 1 + 0.35 * Math.Exp(-3.0 * i / warm) : 1.0;
            r += rrT * warming * (1 + 0.012 * _rng.NextGaussian());
        }

        Close(d);
        ResumeSinusAt(LastROr(p.EndS) + 1.15 * SinusRrAt(LastROr(p.EndS)));
    }

    private void RunPsvt(PlacedSegment p)
    {
        var seg = p.Segment;
        var rate = seg.RateBpm ?? 180;
        var retro = seg.RetrogradeP ?? true;
        var endPause = seg.EndPauseS ?? 1.5;
        var d = Open(p, RhythmNames.Name(seg.Rhythm), RhythmLabels.Svta, OnsetType.Abrupt, OnsetType.Abrupt);
        d.Parameters["rateBpm"] = rate;
        d.Parameters["endPauseS"] = endPause;
        d.Parameters["retrogradeP"] = retro ? 1 : 0;

        // Triggered by a premature atrial beat with an ectopic P, then re-entry at a near-constant cycle.
        var rrT = 60.0 / rate;
        var r = Math.Max(p.StartS, LastROr(p.StartS) + 0.65 * _lastRr);
        Beat(r, BeatClass.S, WaveCatalogue.Normal, WaveCatalogue.PBiphasic, RCentre(r, WaveCatalogue.Normal) - EctopicPrS);
        r += rrT * 1.04;
        while (r < p.EndS)
        {
            // Retrograde P 75 ms after the R centre, in the ST segment (ours).
            Beat(r, BeatClass.S, WaveCatalogue.Normal, retro ? WaveCatalogue.PRetrograde : WaveCatalogue.PNone, RCentre(r, WaveCatalogue.Normal) + 0.075);
            r += rrT + 0.002 * _rng.NextGaussian();
        }

        Close(d);
        var last = LastROr(p.EndS);
        ResumeSinusAt(last + Math.Max(endPause, SinusRrAt(last)));
    }

    private void RunFlutter(PlacedSegment p)
    {
        var seg = p.Segment;
        var atrial = seg.AtrialRateBpm ?? 300;
        var conduction = seg.Conduction ?? "2:1";
        const double avDelayS = 0.24;
        var cycle = 60.0 / atrial;
        var d = Open(p, RhythmNames.Name(seg.Rhythm), RhythmLabels.AtrialFlutter, OnsetType.Abrupt, OnsetType.Abrupt);
        d.Parameters["atrialRateBpm"] = atrial;
        d.Parameters["flutterCycleS"] = cycle;
        d.Parameters["avDelayS"] = avDelayS;
        d.Settings["conduction"] = conduction;

        var origin = p.StartS + 0.05;
        _sources.Add(new ContinuousSource(ContinuousKind.FlutterWaves, p.StartS, p.EndS, _rng.NextSeed(), atrial / 60.0, 1.0, origin));
        var earliest = double.IsNaN(_lastR) ? FirstRS : _lastR + 0.32;
        var k = Math.Max(0L, (long)Math.Ceiling((earliest - avDelayS - origin) / cycle));
        while (true)
        {
            // Each R a fixed delay after a conducted flutter wave: every RR is a whole number of flutter cycles.
            var r = origin + k * cycle + avDelayS;
            if (r >= p.EndS)
            {
                break;
            }

            Beat(r, BeatClass.N, WaveCatalogue.Normal, WaveCatalogue.PNone, double.NaN);
            k += conduction switch
            {
                "2:1" => 2,
                "3:1" => 3,
                "4:1" => 4,
                _ => VariableConduction(),
            };
        }

        Close(d);
        ResumeSinusAt(Math.Max(LastROr(p.EndS) + 1.2 * SinusRrAt(p.EndS), p.EndS + 0.3));
    }

    private int VariableConduction()
    {
        var u = _rng.NextDouble();
        return u < 0.45 ? 2 : u < 0.65 ? 3 : 4;
    }

    private void RunAtrialFibrillation(PlacedSegment p)
    {
        var seg = p.Segment;
        var mean = seg.RateBpm ?? 100;
        var cv = seg.RrCv ?? 0.22;
        var scale = seg.FibrillatoryWaveScale ?? 1.0;
        var d = Open(p, RhythmNames.Name(seg.Rhythm), RhythmLabels.AtrialFibrillation, OnsetType.Abrupt, OnsetType.Abrupt);
        d.Parameters["rateBpm"] = mean;
        d.Parameters["rrCv"] = cv;
        d.Parameters["fibrillatoryWaveScale"] = scale;
        _sources.Add(new ContinuousSource(ContinuousKind.FibrillatoryWaves, p.StartS, p.EndS, _rng.NextSeed(), 6.0, scale, p.StartS));

        // RR independent and log-normal (no correlation between successive beats), floored at 280 ms (AV node refractoriness, ours).
        var sigma = Math.Sqrt(Math.Log(1 + cv * cv));
        var mu = Math.Log(60.0 / mean) - 0.5 * sigma * sigma;
        var r = LastROr(p.StartS);
        while (true)
        {
            r = Math.Max(r + Math.Clamp(Math.Exp(mu + sigma * _rng.NextGaussian()), 0.28, 2.4), p.StartS + 0.1);
            if (r >= p.EndS)
            {
                break;
            }

            Beat(r, BeatClass.N, WaveCatalogue.Normal, WaveCatalogue.PNone, double.NaN);
        }

        Close(d);
        ResumeSinusAt(Math.Max(LastROr(p.EndS) + 1.3 * SinusRrAt(p.EndS), p.EndS + 0.3));
    }

    private void RunMultifocal(PlacedSegment p)
    {
        var seg = p.Segment;
        var rate = seg.RateBpm ?? 115;
        var cv = seg.RrCv ?? 0.12;
        // The foci take over at their full mean rate from the first beat and stop at once (no warm-up or cool-down is
        // synthesised), so the truth says abrupt at both ends.
        var d = Open(p, RhythmNames.Name(seg.Rhythm), RhythmLabels.Svta, OnsetType.Abrupt, OnsetType.Abrupt);
        d.Parameters["rateBpm"] = rate;
        d.Parameters["rrCv"] = cv;

        // Four ectopic foci, each with its own P shape and PR (ours).
        int[] shapes = [WaveCatalogue.PInverted, WaveCatalogue.PBiphasic, WaveCatalogue.PNarrowUpright, WaveCatalogue.PPeaked];
        double[] prS = [0.12, 0.15, 0.18, 0.14];
        var rrMean = 60.0 / rate;
        var r = LastROr(p.StartS);
        while (true)
        {
            r = Math.Max(r + Math.Clamp(rrMean * (1 + cv * _rng.NextGaussian()), 0.36, 0.95), p.StartS + 0.1);
            if (r >= p.EndS)
            {
                break;
            }

            var focus = (int)(_rng.NextDouble() * shapes.Length);
            Beat(r, BeatClass.S, WaveCatalogue.Normal, shapes[focus], RCentre(r, WaveCatalogue.Normal) - prS[focus]);
        }

        Close(d);
        ResumeSinusAt(LastROr(p.EndS) + 1.1 * SinusRrAt(p.EndS));
    }
}
