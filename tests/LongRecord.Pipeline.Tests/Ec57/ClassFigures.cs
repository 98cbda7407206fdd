using System.Globalization;
using System.Text;
using LongRecord.Analysis.Beats;

namespace LongRecord.Pipeline.Tests.Ec57;

/// <summary>
/// Gross class statistics of EC57 for one ectopic class (V for VEB, S for SVEB), from the confusion of matched beats:
/// TP = reference X detected as X; FN = reference X detected as another class or missed; FP = detected X whose
/// reference is N, S or V of another class (reference F and Q beats are not counted against it — EC57 rule, from
/// memory), plus detections labelled X that match no reference beat (stricter than EC57, which we accept).
/// </summary>
public sealed record ClassFigures(string Label, BeatClass Class, IReadOnlyList<BeatMatch> Records)
{
    public long TruePositives => Records.Sum(r => r.Confusion(Class, Class));

    public long FalseNegatives => Records.Sum(FalseNegativesOf);

    public long FalsePositives => Records.Sum(FalsePositivesOf);

    public double SensitivityPercent => 100.0 * TruePositives / Math.Max(1, TruePositives + FalseNegatives);

    public double PositivePredictivityPercent => 100.0 * TruePositives / Math.Max(1, TruePositives + FalsePositives);

    public string Line => string.Create(CultureInfo.InvariantCulture,
        $"{Label}: Se {SensitivityPercent:F1} %, +P {PositivePredictivityPercent:F1} % (TP {TruePositives}, FN {FalseNegatives}, FP {FalsePositives}, {Records.Count} records)");

    public string Table(int worst = 6)
    {
        var sb = new StringBuilder(Line).AppendLine();
        foreach (var r in Records.OrderByDescending(r => FalseNegativesOf(r) + FalsePositivesOf(r)).Take(worst))
        {
            sb.AppendLine(CultureInfo.InvariantCulture, $"    {r.Record,-8} TP {r.Confusion(Class, Class),5}  FN {FalseNegativesOf(r),5}  FP {FalsePositivesOf(r),5}");
        }

        return sb.ToString();
    }

    private long FalseNegativesOf(BeatMatch r) =>
        Enum.GetValues<BeatClass>().Where(c => c != Class).Sum(c => r.Confusion(Class, c)) + r.MissedOf(Class);

    private long FalsePositivesOf(BeatMatch r) =>
        Enum.GetValues<BeatClass>().Where(c => c != Class && c is BeatClass.N or BeatClass.S or BeatClass.V).Sum(c => r.Confusion(c, Class)) + r.ExtraClasses[(int)Class];
}
