using LongRecord.Analysis.Beats;
using LongRecord.Formats.Wfdb;

namespace LongRecord.Analysis.Tests.Classification;

/// <summary>
/// Beat-by-beat comparison as ANSI/AAMI EC57 describes it (from memory): detected and reference beats match when within
/// 150 ms of each other (nearest pairs first, each beat once); the first 5 minutes of each record are the learning
/// period and are not scored; ventricular flutter stretches ([ … ]) are not scored. Reference classes from the MIT-BIH
/// codes: N = N L R e j B, S = A a J S, V = V E, F = F, Q = / f Q. Reference Q beats are left out of the class
/// statistics; a reference F beat detected as V counts neither for nor against VEB positive predictivity.
/// Detected beats with no reference beat count as false positives for their class.
/// </summary>
internal static class Ec57Scoring
{
    private const int Classes = 5;

    public static BeatClass? ReferenceClass(WfdbAnnotationCode code) => WfdbAnnotationCodes.Mnemonic(code) switch
    {
        "N" or "L" or "R" or "e" or "j" or "B" => BeatClass.N,
        "A" or "a" or "J" or "S" => BeatClass.S,
        "V" or "E" => BeatClass.V,
        "F" => BeatClass.F,
        "/" or "f" or "Q" => BeatClass.Q,
        _ => null,
    };

    /// <summary>
    /// Confusion counts: [reference, detected] with index 5 for "no beat" (reference row 5 = detected beat matching no
    /// reference beat; detected column 5 = reference beat with no detection).
    /// </summary>
    public static long[,] Compare(IReadOnlyList<WfdbAnnotation> reference, IReadOnlyList<(long Sample, BeatClass Class)> detected, double fs)
    {
        var tolerance = (long)Math.Round(0.150 * fs);
        var skipBefore = (long)Math.Round(300 * fs);
        var excluded = FlutterStretches(reference);
        bool Scored(long s) => s >= skipBefore && !excluded.Any(x => s >= x.From && s <= x.To);

        var refs = reference.Where(a => a.IsBeat && ReferenceClass(a.Code) is not null).Select(a => (a.Sample, Class: ReferenceClass(a.Code)!.Value)).ToArray();
        var pairs = new List<(long Distance, int Ref, int Det)>();
        var j0 = 0;
        for (var i = 0; i < refs.Length; i++)
        {
            while (j0 < detected.Count && detected[j0].Sample < refs[i].Sample - tolerance)
            {
                j0++;
            }

            for (var j = j0; j < detected.Count && detected[j].Sample <= refs[i].Sample + tolerance; j++)
            {
                pairs.Add((Math.Abs(detected[j].Sample - refs[i].Sample), i, j));
            }
        }

        pairs.Sort((a, b) => a.Distance.CompareTo(b.Distance));
        var refMatch = new int[refs.Length];
        var detMatch = new int[detected.Count];
        Array.Fill(refMatch, -1);
        Array.Fill(detMatch, -1);
        foreach (var (_, r, d) in pairs)
        {
            if (refMatch[r] < 0 && detMatch[d] < 0)
            {
                refMatch[r] = d;
                detMatch[d] = r;
            }
        }

        var m = new long[Classes + 1, Classes + 1];
        for (var i = 0; i < refs.Length; i++)
        {
            if (Scored(refs[i].Sample))
            {
                m[(int)refs[i].Class, refMatch[i] < 0 ? Classes : (int)detected[refMatch[i]].Class]++;
            }
        }

        for (var j = 0; j < detected.Count; j++)
        {
            if (detMatch[j] < 0 && Scored(detected[j].Sample))
            {
                m[Classes, (int)detected[j].Class]++;
            }
        }

        return m;
    }

    public static ClassCounts Veb(long[,] m)
    {
        const int v = (int)BeatClass.V;
        long fn = 0;
        for (var d = 0; d <= Classes; d++)
        {
            fn += d == v ? 0 : m[v, d];
        }

        var fp = m[(int)BeatClass.N, v] + m[(int)BeatClass.S, v] + m[Classes, v];
        return new ClassCounts(m[v, v], fn, fp);
    }

    public static ClassCounts Sveb(long[,] m)
    {
        const int s = (int)BeatClass.S;
        long fn = 0;
        for (var d = 0; d <= Classes; d++)
        {
            fn += d == s ? 0 : m[s, d];
        }

        var fp = m[(int)BeatClass.N, s] + m[(int)BeatClass.V, s] + m[(int)BeatClass.F, s] + m[Classes, s];
        return new ClassCounts(m[s, s], fn, fp);
    }

    private static List<(long From, long To)> FlutterStretches(IReadOnlyList<WfdbAnnotation> reference)
    {
        var list = new List<(long, long)>();
        long start = -1;
        foreach (var a in reference)
        {
            if (a.Code == WfdbAnnotationCode.VentricularFlutterStart)
            {
                start = a.Sample;
            }
            else if (a.Code == WfdbAnnotationCode.VentricularFlutterEnd && start >= 0)
            {
                list.Add((start, a.Sample));
                start = -1;
            }
        }

        if (start >= 0)
        {
            list.Add((start, long.MaxValue));
        }

        return list;
    }
}

internal readonly record struct ClassCounts(long Tp, long Fn, long Fp)
{
    public double Sensitivity => Tp + Fn == 0 ? double.NaN : 100.0 * Tp / (Tp + Fn);

    public double Predictivity => Tp + Fp == 0 ? double.NaN : 100.0 * Tp / (Tp + Fp);

    public static ClassCounts operator +(ClassCounts a, ClassCounts b) => new(a.Tp + b.Tp, a.Fn + b.Fn, a.Fp + b.Fp);
}
