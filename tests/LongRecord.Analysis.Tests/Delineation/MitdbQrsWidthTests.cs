using System.Globalization;
using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;
using Xunit.Abstractions;

namespace LongRecord.Analysis.Tests.Delineation;

/// <summary>
/// QRS width against the MIT-BIH Arrhythmia Database's beat labels: bundle-branch block (L, R) is by definition a QRS
/// of 120 ms or more (AHA/ACCF/HRS recommendations for intraventricular conduction delay, from memory); normal
/// conduction is narrower.
/// </summary>
public sealed class MitdbQrsWidthTests(ITestOutputHelper output)
{
    /// <summary>
    /// In every record with at least 100 beats labelled L or R, their median width is ≥ 120 ms; in every record whose
    /// annotations hold no L, R or paced (/, f) beat, the median width of its N beats is below 120 ms.
    /// </summary>
    [Fact]
    public void Mitdb_BundleBranchBlockBeatsAreBroad_NormalBeatsAreNarrow()
    {
        var names = SharedData.Records("mitdb");
        var lines = new string[names.Count];
        var failures = new List<string>();
        Parallel.For(0, names.Count, new ParallelOptions { MaxDegreeOfParallelism = 2 }, i =>
        {
            var run = MitdbRecordRun.Load(names[i]);
            var bbb = Widths(run, c => c is WfdbAnnotationCode.LeftBundleBranchBlock or WfdbAnnotationCode.RightBundleBranchBlock, out var bbbCount);
            var normal = Widths(run, c => c == WfdbAnnotationCode.Normal, out var normalCount);
            var conductionLabels = run.Beats.Count(b => b.Code is WfdbAnnotationCode.LeftBundleBranchBlock or WfdbAnnotationCode.RightBundleBranchBlock
                or WfdbAnnotationCode.Paced or WfdbAnnotationCode.FusionPacedNormal);
            var line = Inv($"{run.Name}: N {normalCount} beats median {Median(normal):F0} ms ({normalCount - normal.Count} without width); L/R {bbbCount} beats median {Median(bbb):F0} ms ({bbbCount - bbb.Count} without width); L/R/paced labels {conductionLabels}");
            lock (failures)
            {
                lines[i] = line;
                if (bbbCount >= 100 && !(Median(bbb) >= 120))
                {
                    failures.Add(Inv($"{run.Name}: median L/R width {Median(bbb):F0} ms < 120 ms"));
                }

                if (conductionLabels == 0 && normalCount > 0 && !(Median(normal) < 120))
                {
                    failures.Add(Inv($"{run.Name}: median N width {Median(normal):F0} ms ≥ 120 ms"));
                }
            }
        });

        foreach (var line in lines)
        {
            output.WriteLine(line);
        }

        Assert.True(failures.Count == 0, string.Join("; ", failures));
    }

    // Widths of the beats of the given labels; a beat without a width counts as missing from the median's sample.
    private static List<double> Widths(MitdbRecordRun run, Func<WfdbAnnotationCode, bool> label, out int count)
    {
        var widths = new List<double>();
        count = 0;
        for (var i = 0; i < run.Beats.Length; i++)
        {
            if (!label(run.Beats[i].Code))
            {
                continue;
            }

            count++;
            if (run.Results[i].HasQrsBounds)
            {
                widths.Add(run.Results[i].QrsMs);
            }
        }

        return widths;
    }

    private static double Median(List<double> values)
    {
        if (values.Count == 0)
        {
            return double.NaN;
        }

        var s = values.OrderBy(v => v).ToArray();
        return s[s.Length / 2];
    }

    private static string Inv(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
