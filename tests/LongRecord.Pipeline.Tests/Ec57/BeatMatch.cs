using LongRecord.Analysis.Beats;

namespace LongRecord.Pipeline.Tests.Ec57;

/// <summary>
/// Beat-by-beat comparison of ANSI/AAMI EC57: a detected beat matches a reference beat within 150 ms, each beat at most
/// once, nearest pairs first; the first 5 minutes of a record are its learning period and are not scored; stretches
/// of ventricular flutter or fibrillation are scored for neither side. Keeps the class confusion of matched beats.
/// </summary>
public sealed class BeatMatch
{
    public const double WindowS = 0.150;
    public const double LearningS = 300;

    private readonly long[,] _confusion = new long[5, 6]; // [reference class, detected class or 5 = missed]

    public BeatMatch(string record, ReferenceBeats reference, IReadOnlyList<Beat> detected, double fs)
    {
        Record = record;
        var tol = (long)Math.Round(WindowS * fs);
        var start = (long)Math.Round(LearningS * fs);
        var pairs = new List<(long Distance, int Ref, int Det)>();
        var j0 = 0;
        for (var i = 0; i < reference.Samples.Length; i++)
        {
            var r = reference.Samples[i];
            while (j0 < detected.Count && detected[j0].Sample < r - tol)
            {
                j0++;
            }

            for (var j = j0; j < detected.Count && detected[j].Sample <= r + tol; j++)
            {
                pairs.Add((Math.Abs(detected[j].Sample - r), i, j));
            }
        }

        pairs.Sort((a, b) => a.Distance != b.Distance ? a.Distance.CompareTo(b.Distance) : a.Ref != b.Ref ? a.Ref.CompareTo(b.Ref) : a.Det.CompareTo(b.Det));
        var refMatch = new int[reference.Samples.Length];
        Array.Fill(refMatch, -1);
        var detMatched = new bool[detected.Count];
        foreach (var (_, i, j) in pairs)
        {
            if (refMatch[i] < 0 && !detMatched[j])
            {
                refMatch[i] = j;
                detMatched[j] = true;
            }
        }

        for (var i = 0; i < reference.Samples.Length; i++)
        {
            var r = reference.Samples[i];
            if (r < start || reference.IsExcluded(r))
            {
                continue;
            }

            var rc = (int)reference.Classes[i];
            if (refMatch[i] >= 0)
            {
                TruePositives++;
                _confusion[rc, (int)detected[refMatch[i]].Class]++;
            }
            else
            {
                FalseNegatives++;
                _confusion[rc, 5]++;
                Missed.Add(r);
            }
        }

        for (var j = 0; j < detected.Count; j++)
        {
            var d = detected[j].Sample;
            if (!detMatched[j] && d >= start && !reference.IsExcluded(d))
            {
                FalsePositives++;
                Extra.Add(d);
                ExtraClasses[(int)detected[j].Class]++;
            }
        }
    }

    public string Record { get; }
    public long TruePositives { get; }
    public long FalseNegatives { get; }
    public long FalsePositives { get; }
    public List<long> Missed { get; } = new();
    public List<long> Extra { get; } = new();

    /// <summary>Unmatched detections by detected class.</summary>
    public long[] ExtraClasses { get; } = new long[5];

    /// <summary>Matched beats of reference class <paramref name="reference"/> detected as <paramref name="detected"/>.</summary>
    public long Confusion(BeatClass reference, BeatClass detected) => _confusion[(int)reference, (int)detected];

    /// <summary>Reference beats of class <paramref name="reference"/> with no detection.</summary>
    public long MissedOf(BeatClass reference) => _confusion[(int)reference, 5];
}
