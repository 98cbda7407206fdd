using LongRecord.Analysis.Beats;
using LongRecord.Formats.Wfdb;
using LongRecord.Pipeline.Tests.Ec57;

namespace LongRecord.Pipeline.Tests.Episodes;

/// <summary>A reference stretch: a rhythm label's extent, or a run of reference beats.</summary>
/// <param name="Cycles">For a rhythm stretch, the V beats inside it (one per bigeminal cycle); for a run, its beats.</param>
public sealed record ReferenceStretch(string Record, string Label, double StartS, double EndS, int Cycles)
{
    public double DurationS => EndS - StartS;

    public override string ToString() => FormattableString.Invariant($"{Record} {Label} {StartS:0.0}-{EndS:0.0} s");
}

/// <summary>
/// Reference episodes from MIT-BIH annotation files (the MIT-BIH Arrhythmia Database directory's conventions): a rhythm
/// runs from its rhythm-change annotation (the AUX text of a <c>+</c>, such as <c>(AFIB</c>) to the next one, or to
/// the end of the record; labels are compared exactly (<c>(BII</c> is second-degree AV block, not bigeminy). Runs of
/// S-class beats (EC57 classes of the reference beat codes) span their first to their last beat.
/// </summary>
public static class ReferenceRhythms
{
    public static List<ReferenceStretch> Rhythms(string record, IReadOnlyList<WfdbAnnotation> annotations, double fs, double durationS)
    {
        var changes = annotations.Where(a => a.RhythmText is not null).OrderBy(a => a.Sample).ToList();
        var beats = annotations.Where(a => a.IsBeat).ToList();
        var list = new List<ReferenceStretch>();
        for (var i = 0; i < changes.Count; i++)
        {
            var start = changes[i].Sample;
            var end = i + 1 < changes.Count ? changes[i + 1].Sample : (long)Math.Round(durationS * fs);
            var v = beats.Count(b => b.Sample >= start && b.Sample < end && ReferenceBeats.ClassOf(b.Mnemonic[0]) == BeatClass.V);
            list.Add(new ReferenceStretch(record, changes[i].RhythmText!.TrimEnd('\0').Trim(), start / fs, end / fs, v));
        }

        return list;
    }

    /// <summary>Runs of at least <paramref name="minBeats"/> consecutive reference beats of class S (non-beat annotations do not break a run).</summary>
    public static List<ReferenceStretch> SRuns(string record, IReadOnlyList<WfdbAnnotation> annotations, double fs, int minBeats)
    {
        var beats = annotations.Where(a => a.IsBeat).ToList();
        var list = new List<ReferenceStretch>();
        var i = 0;
        while (i < beats.Count)
        {
            if (ReferenceBeats.ClassOf(beats[i].Mnemonic[0]) != BeatClass.S)
            {
                i++;
                continue;
            }

            var j = i;
            while (j + 1 < beats.Count && ReferenceBeats.ClassOf(beats[j + 1].Mnemonic[0]) == BeatClass.S)
            {
                j++;
            }

            if (j - i + 1 >= minBeats)
            {
                list.Add(new ReferenceStretch(record, "S-run", beats[i].Sample / fs, beats[j].Sample / fs, j - i + 1));
            }

            i = j + 1;
        }

        return list;
    }

    /// <summary>Records whose reference holds at least 100 left or right bundle-branch-block beats (L, R), as the beats issue's width check defines them.</summary>
    public static bool HasBundleBranchBlock(IReadOnlyList<WfdbAnnotation> annotations) =>
        annotations.Count(a => a.IsBeat && a.Mnemonic is "L" or "R") >= 100;

    /// <summary>Any overlap (EC57's episode comparison counts any); a zero-length stretch overlaps what contains it.</summary>
    public static bool Overlaps(double aStartS, double aEndS, double bStartS, double bEndS) => aStartS <= bEndS && bStartS <= aEndS;
}
