using LongRecord.Analysis.Beats;
using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Analysis.Tests.Rhythm;

/// <summary>
/// Beats read from a PhysioNet annotation file, as the re-analysis mode hands them to the rhythm stage: classes from
/// the labels when the annotator is reviewed, all N with <see cref="BeatFlags.RrOnly"/> when it is a detector's
/// output; QRS width unknown, P wave not judged.
/// </summary>
public static class AnnotationBeats
{
    public static Beat[] Read(IReadOnlyList<WfdbAnnotation> annotations, bool labelled)
    {
        var list = new List<Beat>(annotations.Count);
        foreach (var a in annotations)
        {
            if (!a.IsBeat || (list.Count > 0 && a.Sample <= list[^1].Sample))
            {
                continue;
            }

            list.Add(Beat.Unmeasured(a.Sample, labelled ? ClassOf(a.Mnemonic[0]) : BeatClass.N, BeatFlags.FromAnnotation | (labelled ? BeatFlags.None : BeatFlags.RrOnly)));
        }

        return [.. list];
    }

    /// <summary>EC57 beat-class mapping of the MIT-BIH codes (ANSI/AAMI EC57 §3.1, from memory).</summary>
    public static BeatClass ClassOf(char code) => code switch
    {
        'N' or 'L' or 'R' or 'e' or 'j' or 'B' => BeatClass.N,
        'A' or 'a' or 'J' or 'S' => BeatClass.S,
        'V' or 'E' or 'r' => BeatClass.V,
        'F' => BeatClass.F,
        _ => BeatClass.Q,
    };

    public static IReadOnlyList<WfdbAnnotation> Annotations(string database, string record, string annotator)
    {
        var path = SharedData.Path(Path.Combine("physionet", database, record + "." + annotator));
        return WfdbAnnotationReader.Read(path);
    }

    public static WfdbHeader Header(string database, string record) =>
        WfdbHeader.Parse(SharedData.Path(Path.Combine("physionet", database, record + ".hea")));
}
