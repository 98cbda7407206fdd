using System.Globalization;
using System.Text;

namespace LongRecord.Pipeline.Tests.Ec57;

/// <summary>Gross QRS detection statistics (counts summed over records, EC57 §4), with the worst records.</summary>
public sealed record DetectionFigures(string Database, IReadOnlyList<BeatMatch> Records)
{
    public long TruePositives => Records.Sum(r => r.TruePositives);
    public long FalseNegatives => Records.Sum(r => r.FalseNegatives);
    public long FalsePositives => Records.Sum(r => r.FalsePositives);
    public double SensitivityPercent => 100.0 * TruePositives / (TruePositives + FalseNegatives);
    public double PositivePredictivityPercent => 100.0 * TruePositives / (TruePositives + FalsePositives);

    public string Line => string.Create(CultureInfo.InvariantCulture,
        $"{Database}: {Records.Count} records, Se {SensitivityPercent:F2} %, +P {PositivePredictivityPercent:F2} % (TP {TruePositives}, FN {FalseNegatives}, FP {FalsePositives})");

    public string Table(int worst = 8)
    {
        var sb = new StringBuilder(Line).AppendLine();
        foreach (var r in Records.OrderByDescending(r => r.FalseNegatives + r.FalsePositives).Take(worst))
        {
            sb.AppendLine(CultureInfo.InvariantCulture, $"    {r.Record,-8} TP {r.TruePositives,6}  FN {r.FalseNegatives,4}  FP {r.FalsePositives,4}");
        }

        return sb.ToString();
    }
}
