using LongRecord.Analysis.Beats;
using LongRecord.Formats.Wfdb;

namespace LongRecord.Pipeline.Tests.Ec57;

/// <summary>
/// Reference beats of an annotation file as ANSI/AAMI EC57 scores them: the beat codes N L R B A a J S V r F e j n E / f Q
/// (not ! ~ | + x " and the other non-beat codes), each mapped to its EC57 class, and the stretches of ventricular
/// flutter or fibrillation (between <c>[</c> and <c>]</c>) that are scored for neither side.
/// </summary>
public sealed record ReferenceBeats(long[] Samples, BeatClass[] Classes, char[] Codes, (long Start, long End)[] Excluded)
{
    public static ReferenceBeats From(IReadOnlyList<WfdbAnnotation> annotations, long recordEnd)
    {
        var samples = new List<long>();
        var classes = new List<BeatClass>();
        var codes = new List<char>();
        var excluded = new List<(long, long)>();
        long? open = null;
        foreach (var a in annotations)
        {
            if (a.Code == WfdbAnnotationCode.VentricularFlutterStart)
            {
                open ??= a.Sample;
            }
            else if (a.Code == WfdbAnnotationCode.VentricularFlutterEnd && open is long s)
            {
                excluded.Add((s, a.Sample));
                open = null;
            }
            else if (a.IsBeat)
            {
                var m = a.Mnemonic;
                samples.Add(a.Sample);
                codes.Add(m[0]);
                classes.Add(ClassOf(m[0]));
            }
        }

        if (open is long o)
        {
            excluded.Add((o, recordEnd));
        }

        return new ReferenceBeats(samples.ToArray(), classes.ToArray(), codes.ToArray(), excluded.ToArray());
    }

    /// <summary>EC57 class of an MIT-BIH beat code (EC57 Table 1 as recalled: N = N L R e j B; S = A a J S; V = V E; F = F; Q = / f Q).</summary>
    public static BeatClass ClassOf(char code) => code switch
    {
        'N' or 'L' or 'R' or 'e' or 'j' or 'B' => BeatClass.N,
        'A' or 'a' or 'J' or 'S' => BeatClass.S,
        'V' or 'E' or 'r' => BeatClass.V,
        'F' => BeatClass.F,
        _ => BeatClass.Q,
    };

    public bool IsExcluded(long sample)
    {
        foreach (var (start, end) in Excluded)
        {
            if (sample >= start && sample <= end)
            {
                return true;
            }
        }

        return false;
    }
}
