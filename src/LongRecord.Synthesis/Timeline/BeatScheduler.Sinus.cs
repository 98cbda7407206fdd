using LongRecord.Synthesis.Model;
using LongRecord.Synthesis.Scenarios;
using LongRecord.Synthesis.Truth;

namespace LongRecord.Synthesis.Timeline;

/// <summary>Rhythms driven by the sinus node: sinus (with ectopy, pauses, blocked P), bradycardia, tachycardia, bigeminy, trigeminy, second-degree block.</summary>
internal sealed partial class BeatScheduler
{
    // Ectopic P peak before the R centre, seconds (ours).
    private const double EctopicPrS = 0.15;

    private void RunSinusDriven(PlacedSegment p)
    {
        var seg = p.Segment;
        var kind = seg.Rhythm;
        var draft = Open(p, RhythmNames.Name(kind), RhythmLabels.For(kind), Onset(kind), Onset(kind));
        var rate = RateFunction(p, draft);
        var ectopy = seg.Ectopy;
        var events = seg.Events;
        var nextEvent = 0;
        var pvcEvery = kind switch { RhythmKind.VentricularBigeminy => 1, RhythmKind.VentricularTrigeminy => 2, _ => 0 };
        var coupling = seg.CouplingFraction ?? 0.6;
        var bigeminyMorph = ParseMorph(seg.Morphology, WaveCatalogue.VentricularA);
        var blockEvery = seg.ConductionRatio is string ratio ? int.Parse(ratio.Split(':')[0], System.Globalization.CultureInfo.InvariantCulture) : 0;
        if (pvcEvery > 0)
        {
            draft.Parameters["couplingFraction"] = coupling;
            draft.Settings["morphology"] = WaveCatalogue.Morphologies[bigeminyMorph].Name;
        }

        if (blockEvery > 0)
        {
            draft.Settings["conductionRatio"] = seg.ConductionRatio!;
        }

        if (_resumeAt is double resume)
        {
            _tp = Math.Max(resume, p.StartS) - 60.0 / rate(resume);
            _resumeAt = null;
        }
        else if (double.IsNaN(_tp))
        {
            _tp = Math.Max(p.StartS, FirstRS) - 60.0 / rate(p.StartS);
        }

        var sinceEctopic = 0;
        var pCount = 0;
        while (true)
        {
            var rr = _sinus.NextRrS(_tp, rate(_tp), _rng, withDrift: kind != RhythmKind.SinusTachycardia);
            var tn = _tp + rr;
            if (tn >= p.EndS)
            {
                break;
            }

            var lastWasSinus = _lastR == _tp;
            if (nextEvent < events.Count && p.StartS + events[nextEvent].AtS <= tn)
            {
                var ev = events[nextEvent++];
                if (lastWasSinus || ev.Kind is SegmentEventKind.Pause or SegmentEventKind.BlockedP)
                {
                    ScriptedEvent(p, ev, rr, tn);
                    sinceEctopic = 0;
                    continue;
                }
            }

            if (pvcEvery > 0 && lastWasSinus && sinceEctopic >= pvcEvery)
            {
                var c = coupling + 0.01 * _rng.NextGaussian();
                Beat(_tp + c * rr, BeatClass.V, bigeminyMorph, WaveCatalogue.PNone, double.NaN);
                _tp = tn;
                sinceEctopic = 0;
                continue;
            }

            if (blockEvery > 0 && ++pCount % blockEvery == 0)
            {
                LoneP(RCentre(tn, WaveCatalogue.Normal) + WaveCatalogue.SinusPOffsetS(rr), Complex.ClassNonConductedP, WaveCatalogue.PSinus);
                _tp = tn;
                continue;
            }

            if (ectopy is not null && lastWasSinus && sinceEctopic >= 2 && RandomEctopy(p, ectopy, rr, tn))
            {
                sinceEctopic = 0;
                continue;
            }

            SinusBeat(tn, rr);
            sinceEctopic++;
        }

        Close(draft);
        if (draft.BeatTimes is { Count: > 1 } times)
        {
            TachycardiaExtent(draft, times);
        }
    }

    private static OnsetType Onset(RhythmKind kind) =>
        kind is RhythmKind.VentricularBigeminy or RhythmKind.VentricularTrigeminy or RhythmKind.SecondDegreeAvBlock ? OnsetType.Abrupt : OnsetType.Gradual;

    private Func<double, double> RateFunction(PlacedSegment p, IntervalDraft draft)
    {
        var seg = p.Segment;
        switch (seg.Rhythm)
        {
            case RhythmKind.SinusBradycardia:
            {
                var fixedRate = seg.RateBpm ?? 44;
                draft.Parameters["rateBpm"] = fixedRate;
                return _ => fixedRate;
            }

            case RhythmKind.SinusTachycardia:
            {
                var target = seg.RateBpm ?? 130;
                var length = p.Segment.DurationS;
                var up = seg.RampUpS ?? Math.Min(45, length / 3);
                var down = seg.RampDownS ?? Math.Min(60, length / 3);
                var from = _sinus.CircadianRateBpm(p.StartS);
                draft.Parameters["rateBpm"] = target;
                draft.Parameters["baseRateBpm"] = Math.Round(from, 1);
                draft.Parameters["rampUpS"] = up;
                draft.Parameters["rampDownS"] = down;
                draft.BeatTimes = [];
                var start = p.StartS;
                var end = p.StartS + length;
                return t =>
                {
                    var ramp = t < start + up ? Smooth((t - start) / up) : t > end - down ? Smooth((end - t) / down) : 1.0;
                    return from + (target - from) * ramp;
                };
            }

            default:
                if (seg.RateBpm is double r)
                {
                    draft.Parameters["rateBpm"] = r;
                    return _ => r;
                }

                return _sinus.CircadianRateBpm;
        }
    }

    private static double Smooth(double x) => 0.5 - 0.5 * Math.Cos(Math.PI * Math.Clamp(x, 0, 1));

    // Sinus tachycardia: where the instantaneous rate first and last exceeds 100 bpm.
    private static void TachycardiaExtent(IntervalDraft d, List<double> times)
    {
        double first = double.NaN, last = double.NaN;
        for (var i = 1; i < times.Count; i++)
        {
            if (60.0 / (times[i] - times[i - 1]) > 100)
            {
                first = double.IsNaN(first) ? times[i] : first;
                last = times[i];
            }
        }

        if (!double.IsNaN(first))
        {
            d.Parameters["rateAbove100FromS"] = first;
            d.Parameters["rateAbove100ToS"] = last;
        }

        d.BeatTimes = null;
    }

    private void SinusBeat(double tS, double rr)
    {
        Beat(tS, BeatClass.N, WaveCatalogue.Normal, WaveCatalogue.PSinus, RCentre(tS, WaveCatalogue.Normal) + WaveCatalogue.SinusPOffsetS(rr));
        _tp = tS;
    }

    private void ScriptedEvent(PlacedSegment p, SegmentEvent ev, double rr, double tn)
    {
        switch (ev.Kind)
        {
            case SegmentEventKind.Pac:
                AtrialEctopy(p, rr, ev.Count, ev.RateBpm, ev.PShape is string s ? WaveCatalogue.PShapeByName(s) : RandomEctopicP());
                break;
            case SegmentEventKind.Pvc:
                VentricularEctopy(p, rr, tn, ev.Count, ev.RateBpm, ParseMorph(ev.Morphology, WaveCatalogue.VentricularA));
                break;
            case SegmentEventKind.Pause:
                Pause(p, ev.DurationS ?? 2.5, rr);
                break;
            default:
                LoneP(RCentre(tn, WaveCatalogue.Normal) + WaveCatalogue.SinusPOffsetS(rr), Complex.ClassNonConductedP, WaveCatalogue.PSinus);
                _tp = tn;
                break;
        }
    }

    private bool RandomEctopy(PlacedSegment p, EctopySettings e, double rr, double tn)
    {
        var perBeat = rr / 3600.0;
        var u = _rng.NextDouble();
        var runBeats = e.RunBeatsMin + (int)(_rng.NextDouble() * (e.RunBeatsMax - e.RunBeatsMin + 1));
        var focus = _rng.NextDouble() < e.SecondFocusFraction ? WaveCatalogue.VentricularB : WaveCatalogue.VentricularA;
        if ((u -= e.PvcPerHour * perBeat) < 0)
        {
            VentricularEctopy(p, rr, tn, 1, null, focus);
        }
        else if ((u -= e.PacPerHour * perBeat) < 0)
        {
            AtrialEctopy(p, rr, 1, null, RandomEctopicP());
        }
        else if ((u -= e.PvcCoupletsPerHour * perBeat) < 0)
        {
            VentricularEctopy(p, rr, tn, 2, null, focus);
        }
        else if ((u -= e.VeRunsPerHour * perBeat) < 0)
        {
            VentricularEctopy(p, rr, tn, runBeats, _rng.Uniform(120, 180), focus);
        }
        else if ((u -= e.SveRunsPerHour * perBeat) < 0)
        {
            AtrialEctopy(p, rr, runBeats, _rng.Uniform(130, 180), RandomEctopicP());
        }
        else
        {
            return false;
        }

        return true;
    }

    private int RandomEctopicP() => WaveCatalogue.PInverted + (int)(_rng.NextDouble() * 3);

    // Premature atrial beat(s): early, ectopic P, narrow QRS; the sinus node is reset (non-compensatory pause).
    private void AtrialEctopy(PlacedSegment p, double rr, int count, double? rateBpm, int pShape)
    {
        var episode = count >= 2 ? Open(p, count == 2 ? "sve-couplet" : "sve-run", count == 2 ? RhythmLabels.None : RhythmLabels.Svta, OnsetType.Abrupt, OnsetType.Abrupt, episode: true) : null;
        var restore = _label;
        var runRr = 60.0 / (rateBpm ?? 150);
        var r = _tp + _rng.Uniform(0.62, 0.78) * rr;
        for (var i = 0; i < count && r < p.EndS; i++)
        {
            Beat(r, BeatClass.S, WaveCatalogue.Normal, pShape, RCentre(r, WaveCatalogue.Normal) - EctopicPrS);
            r += runRr * (1 + 0.03 * _rng.NextGaussian());
        }

        if (episode is not null)
        {
            episode.Parameters["beats"] = count;
            episode.Parameters["rateBpm"] = Math.Round(60.0 / runRr, 1);
            Close(episode, restore);
        }

        _tp = _lastR + 0.08 * rr;
    }

    // Premature ventricular beat(s): early, broad, no P; the sinus node is undisturbed (full compensatory pause).
    private void VentricularEctopy(PlacedSegment p, double rr, double tn, int count, double? rateBpm, int morph)
    {
        var episode = count >= 2 ? Open(p, count == 2 ? "ve-couplet" : "ve-run", count == 2 ? RhythmLabels.None : RhythmLabels.VentricularTachycardia, OnsetType.Abrupt, OnsetType.Abrupt, episode: true) : null;
        var restore = _label;
        var runRr = 60.0 / (rateBpm ?? 140);
        var r = _tp + _rng.Uniform(0.55, 0.68) * rr;
        for (var i = 0; i < count && r < p.EndS; i++)
        {
            Beat(r, BeatClass.V, morph, WaveCatalogue.PNone, double.NaN);
            r += runRr * (1 + 0.02 * _rng.NextGaussian());
        }

        if (episode is not null)
        {
            episode.Parameters["beats"] = count;
            episode.Parameters["rateBpm"] = Math.Round(60.0 / runRr, 1);
            episode.Settings["morphology"] = WaveCatalogue.Morphologies[morph].Name;
            Close(episode, restore);
        }

        _tp = tn;
        while (_tp + rr < _lastR + 0.55 * rr)
        {
            _tp += rr;
        }
    }

    // Sinus arrest: no P, no QRS from the last R for durationS; the sinus node restarts there.
    private void Pause(PlacedSegment p, double durationS, double rr)
    {
        var before = _lastR;
        var after = before + durationS;
        if (double.IsNaN(before) || after >= p.EndS)
        {
            return;
        }

        var episode = Open(p, "pause", RhythmLabels.None, OnsetType.Abrupt, OnsetType.Abrupt, episode: true);
        Close(episode);
        episode.FixedStartS = before;
        episode.FixedEndS = after;
        episode.Parameters["durationS"] = durationS;
        SinusBeat(after, Math.Max(rr, 1.2));
    }
}
