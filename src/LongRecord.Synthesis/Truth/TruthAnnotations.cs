using LongRecord.Synthesis.Timeline;

namespace LongRecord.Synthesis.Truth;

/// <summary>Builds the neutral annotation stream from the schedule, lazily and in sample order.</summary>
internal static class TruthAnnotations
{
    public static IEnumerable<TruthAnnotation> Build(RecordingTruth truth, Complex[] complexes, ContinuousSource[] sources)
    {
        var extras = Extras(truth, sources);
        var next = 0;
        byte current = RhythmLabels.None;
        foreach (var c in complexes)
        {
            var anchor = c.AnchorS;
            var sample = truth.Sample(anchor);
            while (next < extras.Count && extras[next].Sample <= sample)
            {
                var e = extras[next++];
                current = e.Code == "[" ? e.Label : e.Code == "]" ? RhythmLabels.None : current;
                yield return e.Annotation;
            }

            if (!c.IsBeat)
            {
                if (c.Class == Complex.ClassNonConductedP)
                {
                    yield return new TruthAnnotation(sample, anchor, "x");
                }

                continue;
            }

            if (c.Label != current && c.Label != RhythmLabels.None)
            {
                current = c.Label;
                yield return new TruthAnnotation(sample, anchor, "+", RhythmLabels.Text(current));
            }

            yield return new TruthAnnotation(sample, anchor, BeatCode(c));
        }

        while (next < extras.Count)
        {
            yield return extras[next++].Annotation;
        }
    }

    private static string BeatCode(in Complex c) => (BeatClass)c.Class switch
    {
        BeatClass.N => "N",
        BeatClass.V => "V",
        _ => !double.IsNaN(c.PTimeS) && c.PTimeS < c.RTimeS ? "A" : "S",
    };

    private sealed record Extra(long Sample, string Code, byte Label, TruthAnnotation Annotation);

    private static List<Extra> Extras(RecordingTruth truth, ContinuousSource[] sources)
    {
        var list = new List<Extra>();
        foreach (var s in sources)
        {
            if (s.Kind is not (ContinuousKind.VentricularFlutter or ContinuousKind.VentricularFibrillation))
            {
                continue;
            }

            var label = s.Kind == ContinuousKind.VentricularFlutter ? RhythmLabels.VentricularFlutter : RhythmLabels.VentricularFibrillation;
            var a = truth.Sample(s.StartS);
            var b = truth.Sample(s.EndS);
            list.Add(new Extra(a, "+", label, new TruthAnnotation(a, s.StartS, "+", RhythmLabels.Text(label))));
            list.Add(new Extra(a, "[", label, new TruthAnnotation(a, s.StartS, "[")));
            list.Add(new Extra(b, "]", label, new TruthAnnotation(b, s.EndS, "]")));
        }

        // Signal quality changes: at each start or end of a stretch, the union of the leads noisy from there on.
        var points = truth.Noise.SelectMany(n => new[] { n.StartSample, n.EndSample }).Distinct().Order().ToList();
        foreach (var p in points)
        {
            var mask = 0;
            var kinds = new List<string>();
            for (var i = 0; i < truth.Noise.Count; i++)
            {
                var n = truth.Noise[i];
                if (n.StartSample <= p && p < n.EndSample)
                {
                    mask |= truth.NoiseLeadMasks[i];
                    if (!kinds.Contains(n.Kind))
                    {
                        kinds.Add(n.Kind);
                    }
                }
            }

            var aux = kinds.Count == 0 ? "clean" : string.Join(",", kinds);
            list.Add(new Extra(p, "~", 0, new TruthAnnotation(p, p / truth.SamplingRateHz, "~", aux, mask)));
        }

        return [.. list.Select((e, i) => (e, i)).OrderBy(p => p.e.Sample).ThenBy(p => p.i).Select(p => p.e)];
    }
}
