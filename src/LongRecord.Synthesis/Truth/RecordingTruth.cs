using LongRecord.Synthesis.Model;
using LongRecord.Synthesis.Timeline;

namespace LongRecord.Synthesis.Truth;

/// <summary>
/// Ground truth of a synthetic recording, in time order. Beats are a view over the schedule, built on demand, so the
/// truth costs the schedule's <see cref="BytesPerBeat"/> bytes per beat and nothing more.
/// </summary>
public sealed class RecordingTruth
{
    /// <summary>Schedule bytes per beat: a 32-byte complex plus a 4-byte index.</summary>
    public const int BytesPerBeat = 36;

    private readonly Complex[] _complexes;
    private readonly int[] _beatIndex;
    private readonly LeadMorphologies _morph;
    private readonly double _fs;
    private readonly ContinuousSource[] _sources;

    internal RecordingTruth(Complex[] complexes, ContinuousSource[] sources, LeadMorphologies morph, double samplingRateHz,
        IReadOnlyList<RhythmInterval> rhythms, IReadOnlyList<NoiseInterval> noise, IReadOnlyList<int> noiseLeadMasks)
    {
        _complexes = complexes;
        _sources = sources;
        _morph = morph;
        _fs = samplingRateHz;
        var beats = new List<int>();
        var pWaves = new List<TruthPWave>();
        for (var i = 0; i < complexes.Length; i++)
        {
            if (complexes[i].IsBeat)
            {
                beats.Add(i);
            }
            else
            {
                var c = complexes[i];
                pWaves.Add(new TruthPWave(c.PTimeS, Sample(c.PTimeS), c.Class == Complex.ClassNonConductedP, WaveCatalogue.PShapes[c.PShape].Name));
            }
        }

        _beatIndex = [.. beats];
        Beats = new BeatList(this);
        PWaves = pWaves;
        Rhythms = rhythms;
        Noise = noise;
        NoiseLeadMasks = noiseLeadMasks;
    }

    public IReadOnlyList<TruthBeat> Beats { get; }

    /// <summary>P waves with no QRS of their own (non-conducted or dissociated).</summary>
    public IReadOnlyList<TruthPWave> PWaves { get; }

    /// <summary>Timeline segments and the episodes inside them, ordered by start.</summary>
    public IReadOnlyList<RhythmInterval> Rhythms { get; }

    public IReadOnlyList<NoiseInterval> Noise { get; }

    internal IReadOnlyList<int> NoiseLeadMasks { get; }

    /// <summary>The neutral annotation list (beats, rhythm changes, noise changes, non-conducted P), in sample order.</summary>
    public IEnumerable<TruthAnnotation> Annotations() => TruthAnnotations.Build(this, _complexes, _sources);

    internal long Sample(double tS) => (long)Math.Round(tS * _fs);

    internal double SamplingRateHz => _fs;

    private TruthBeat MakeBeat(int index)
    {
        var c = _complexes[_beatIndex[index]];
        var m = c.Morph;
        var onset = c.RTimeS + _morph.QrsOnsetS[m];
        var offset = c.RTimeS + _morph.QrsOffsetS[m];
        var tEnd = c.RTimeS + _morph.TEndS(m, c.RrS);
        var hasP = !double.IsNaN(c.PTimeS);
        var kind = !hasP ? PWaveKind.None
            : c.PShape == WaveCatalogue.PSinus ? PWaveKind.Sinus
            : c.PShape == WaveCatalogue.PRetrograde ? PWaveKind.Retrograde
            : PWaveKind.Ectopic;
        double? rr = index == 0 ? null : c.RTimeS - _complexes[_beatIndex[index - 1]].RTimeS;
        return new TruthBeat(
            index, c.RTimeS, Sample(c.RTimeS), (BeatClass)c.Class, WaveCatalogue.Morphologies[m].Name, WaveCatalogue.Morphologies[m].IsBroad,
            onset, offset, Sample(onset), Sample(offset),
            kind, hasP ? c.PTimeS : null, hasP ? Sample(c.PTimeS) : null, hasP ? WaveCatalogue.PShapes[c.PShape].Name : null,
            tEnd, Sample(tEnd), rr);
    }

    private sealed class BeatList(RecordingTruth owner) : IReadOnlyList<TruthBeat>
    {
        public TruthBeat this[int index] =>
            (uint)index < (uint)owner._beatIndex.Length ? owner.MakeBeat(index) : throw new ArgumentOutOfRangeException(nameof(index));

        public int Count => owner._beatIndex.Length;

        public IEnumerator<TruthBeat> GetEnumerator()
        {
            for (var i = 0; i < Count; i++)
            {
                yield return owner.MakeBeat(i);
            }
        }

        System.Collections.IEnumerator System.Collections.IEnumerable.GetEnumerator() => GetEnumerator();
    }
}
