using System.Globalization;
using System.Text;
using LongRecord.Analysis.Tests.Support;
using LongRecord.TestSupport;

namespace LongRecord.Analysis.Tests.Classification;

/// <summary>Runs the classifier over every record of a database (two at a time) and tabulates EC57 figures.</summary>
internal sealed class DatabaseFigures
{
    public DatabaseFigures(string database, IEnumerable<string> excluded)
    {
        var skip = excluded.ToHashSet();
        var names = SharedData.Records(database).Where(r => !skip.Contains(r)).ToArray();
        var results = new ClassifierRun.Result[names.Length];
        Parallel.For(0, names.Length, new ParallelOptions { MaxDegreeOfParallelism = 2 }, i =>
        {
            results[i] = ClassifierRun.Run(ReferenceRecord.Load(database, names[i]));
        });
        Results = results;
    }

    public IReadOnlyList<ClassifierRun.Result> Results { get; }

    public (ClassCounts Veb, ClassCounts Sveb) Gross(Func<string, bool> include)
    {
        ClassCounts v = default, s = default;
        foreach (var r in Results.Where(r => include(r.Record)))
        {
            v += Ec57Scoring.Veb(r.Confusion);
            s += Ec57Scoring.Sveb(r.Confusion);
        }

        return (v, s);
    }

    public string Table()
    {
        var sb = new StringBuilder();
        sb.AppendLine("record  V:TP    FN    FP   S:TP    FN    FP   beats  classify-ms");
        foreach (var r in Results)
        {
            var v = Ec57Scoring.Veb(r.Confusion);
            var s = Ec57Scoring.Sveb(r.Confusion);
            sb.AppendLine(string.Create(CultureInfo.InvariantCulture,
                $"{r.Record,-6} {v.Tp,6} {v.Fn,5} {v.Fp,5} {s.Tp,6} {s.Fn,5} {s.Fp,5} {r.Beats.Count,7} {r.ClassifierTime.TotalMilliseconds,9:F1}"));
        }

        return sb.ToString();
    }

    public string Confusions()
    {
        var sb = new StringBuilder();
        foreach (var r in Results)
        {
            sb.Append(r.Record).Append(':');
            for (var i = 0; i < 6; i++)
            {
                sb.Append(" |");
                for (var j = 0; j < 6; j++)
                {
                    sb.Append(' ').Append(r.Confusion[i, j]);
                }
            }

            sb.AppendLine();
        }

        return sb.ToString();
    }

    public string Worst(Func<ClassifierRun.Result, ClassCounts> pick, string label, int count = 5)
    {
        var worst = Results.Select(r => (r.Record, C: pick(r))).OrderByDescending(x => x.C.Fn + x.C.Fp).Take(count);
        return label + " worst (FN+FP): " + string.Join(", ", worst.Select(w => string.Create(CultureInfo.InvariantCulture, $"{w.Record} (FN {w.C.Fn}, FP {w.C.Fp})")));
    }

    public static string Line(string label, ClassCounts c) =>
        string.Create(CultureInfo.InvariantCulture, $"{label}: TP {c.Tp} FN {c.Fn} FP {c.Fp}  Se {c.Sensitivity:F1} %  +P {c.Predictivity:F1} %");
}
