using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Beats.Classification;
using LongRecord.Pipeline.Inputs;

namespace LongRecord.Pipeline;

/// <summary>
/// Beats of a recording analysed from an annotation file alone (no signal): positions as given, classes as a reviewed
/// annotator labelled them or, for unlabelled beats, from RR rules alone (prematurity, compensatory pause), marked
/// RR-only. Nothing is measured on a signal: QRS width, P wave and lead quality stay unknown.
/// </summary>
public static class BeatsFromAnnotations
{
    public static List<Beat> Build(ExternalBeats given, double referenceRateHz)
    {
        var beats = new List<Beat>(given.Samples.Count);
        if (given.Classes is IReadOnlyList<BeatClass> classes)
        {
            for (var i = 0; i < given.Samples.Count; i++)
            {
                beats.Add(Beat.Unmeasured(given.Samples[i], classes[i], BeatFlags.FromAnnotation | BeatFlags.Labelled));
            }

            return beats;
        }

        var rr = new RrOnlyClassifier(referenceRateHz);
        foreach (var s in given.Samples)
        {
            rr.Add(s);
            Take(rr, beats);
        }

        rr.Flush();
        Take(rr, beats);
        return beats;
    }

    private static void Take(RrOnlyClassifier rr, List<Beat> beats)
    {
        while (rr.TryTake(out var c))
        {
            beats.Add(Beat.Unmeasured(c.Sample, c.Class, c.Flags | BeatFlags.RrOnly | BeatFlags.FromAnnotation));
        }
    }
}
