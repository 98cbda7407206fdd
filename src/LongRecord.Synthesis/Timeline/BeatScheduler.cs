using LongRecord.Synthesis.Model;
using LongRecord.Synthesis.Randomness;
using LongRecord.Synthesis.Scenarios;
using LongRecord.Synthesis.Truth;

namespace LongRecord.Synthesis.Timeline;

/// <summary>
/// Walks the placed timeline once, in order, and schedules every beat, lone P wave and continuous source, with the
/// rhythm intervals they form. Deterministic for a seed: one sequential random stream drives every choice.
/// </summary>
internal sealed partial class BeatScheduler
{
    /// <summary>Earliest R time, so the first P wave lies inside the recording.</summary>
    private const double FirstRS = 0.45;

    private readonly SequentialRandom _rng;
    private readonly SinusRateModel _sinus;
    private readonly LeadMorphologies _morph;
    private readonly double _durationS;
    private readonly List<Complex> _complexes = [];
    private readonly List<ContinuousSource> _sources = [];
    private readonly List<IntervalDraft> _intervals = [];
    private readonly List<IntervalDraft> _open = [];

    private double _lastR = double.NaN;
    private double _lastRr = 0.8;

    // Last sinus-node discharge, in R-time terms; NaN when the sinus node is not driving.
    private double _tp = double.NaN;

    // First sinus R after a rhythm that suppressed the sinus node.
    private double? _resumeAt;
    private byte _label;

    public BeatScheduler(Scenario scenario, DateTime start, ulong seed, LeadMorphologies morph, double durationS)
    {
        _rng = new SequentialRandom(seed);
        _sinus = new SinusRateModel(start, scenario.Circadian, seed);
        _morph = morph;
        _durationS = durationS;
    }

    public Schedule Run(IReadOnlyList<PlacedSegment> segments)
    {
        foreach (var p in segments)
        {
            switch (p.Segment.Rhythm)
            {
                case RhythmKind.Sinus or RhythmKind.SinusBradycardia or RhythmKind.SinusTachycardia
                    or RhythmKind.VentricularBigeminy or RhythmKind.VentricularTrigeminy or RhythmKind.SecondDegreeAvBlock:
                    RunSinusDriven(p);
                    break;
                case RhythmKind.FocalAtrialTachycardia:
                    RunFocalAtrialTachycardia(p);
                    break;
                case RhythmKind.Psvt:
                    RunPsvt(p);
                    break;
                case RhythmKind.AtrialFlutter:
                    RunFlutter(p);
                    break;
                case RhythmKind.AtrialFibrillation:
                    RunAtrialFibrillation(p);
                    break;
                case RhythmKind.MultifocalAtrialTachycardia:
                    RunMultifocal(p);
                    break;
                case RhythmKind.BroadComplexTachycardia:
                    RunBroadComplexTachycardia(p);
                    break;
                default:
                    RunVentricularWaves(p);
                    break;
            }
        }

        return new Schedule(SortedComplexes(), [.. _sources], _intervals.Where(i => !i.IsEmpty).ToArray());
    }

    private Complex[] SortedComplexes()
    {
        var items = _complexes.ToArray();
        var keys = new (double, int)[items.Length];
        for (var i = 0; i < items.Length; i++)
        {
            keys[i] = (items[i].AnchorS, i);
        }

        Array.Sort(keys, items);
        return items;
    }

    private IntervalDraft Open(PlacedSegment p, string kind, byte label, OnsetType onset, OnsetType offset, bool episode = false)
    {
        var d = new IntervalDraft { Kind = kind, Label = label, Onset = onset, Offset = offset, IsEpisode = episode, SegmentIndex = p.SegmentIndex };
        _intervals.Add(d);
        _open.Add(d);
        if (label != RhythmLabels.None)
        {
            _label = label;
        }

        return d;
    }

    private void Close(IntervalDraft d, byte restoreLabel = RhythmLabels.None)
    {
        _open.Remove(d);
        if (restoreLabel != RhythmLabels.None)
        {
            _label = restoreLabel;
        }
    }

    /// <summary>Adds a beat unless its waves would fall outside the recording; returns whether it was added.</summary>
    private bool Beat(double rS, BeatClass cls, int morph, int pShape, double pTimeS)
    {
        var rr = double.IsNaN(_lastR) ? _lastRr : rS - _lastR;
        if (rS < FirstRS || rS + _morph.TEndS(morph, rr) >= _durationS - 0.02 || (!double.IsNaN(pTimeS) && pTimeS < 0.1))
        {
            return false;
        }

        _complexes.Add(new Complex
        {
            RTimeS = rS,
            PTimeS = pShape == WaveCatalogue.PNone ? double.NaN : pTimeS,
            RrS = (float)rr,
            QrsScale = (float)(_sinus.RespiratoryAmplitude(rS) * (1 + 0.015 * _rng.NextGaussian())),
            PScale = (float)(1 + 0.03 * _rng.NextGaussian()),
            Morph = (byte)morph,
            PShape = (byte)pShape,
            Class = (byte)cls,
            Label = _label,
        });
        foreach (var d in _open)
        {
            if (d.BeatCount == 0)
            {
                d.FirstRS = rS;
            }

            d.LastRS = rS;
            d.BeatCount++;
            d.BeatTimes?.Add(rS);
        }

        _lastR = rS;
        _lastRr = rr;
        return true;
    }

    private void LoneP(double pTimeS, byte cls, int pShape)
    {
        if (pTimeS < 0.1 || pTimeS + 0.1 >= _durationS)
        {
            return;
        }

        _complexes.Add(new Complex
        {
            RTimeS = double.NaN,
            PTimeS = pTimeS,
            RrS = 1,
            QrsScale = 1,
            PScale = (float)(1 + 0.03 * _rng.NextGaussian()),
            Morph = Complex.NoMorph,
            PShape = (byte)pShape,
            Class = cls,
            Label = _label,
        });
    }

    /// <summary>R wave centre of a beat whose fiducial is at <paramref name="rS"/>.</summary>
    private double RCentre(double rS, int morph) => rS - _morph.FiducialShiftS[morph];

    private double SinusRrAt(double tS) => 60.0 / _sinus.CircadianRateBpm(tS);

    private double LastROr(double fallbackS) => double.IsNaN(_lastR) ? fallbackS : _lastR;

    /// <summary>Hands control back to the sinus node at <paramref name="resumeS"/> after a rhythm that suppressed it.</summary>
    private void ResumeSinusAt(double resumeS)
    {
        _tp = double.NaN;
        _resumeAt = resumeS;
    }

    private int ParseMorph(string? name, int fallback) => name switch
    {
        "ventricular-a" => WaveCatalogue.VentricularA,
        "ventricular-b" => WaveCatalogue.VentricularB,
        _ => fallback,
    };
}
