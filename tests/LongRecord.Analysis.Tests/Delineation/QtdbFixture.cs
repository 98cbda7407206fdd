using LongRecord.Analysis.Tests.Support;
using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Analysis.Tests.Delineation;

/// <summary>
/// The QT Database records present in the shared data (qtdb, 250 Hz, two leads) with their manual waveform boundaries
/// (annotator 1, <c>.q1c</c>), each annotated beat delineated once for all the tests of the class. In q1c the <c>(</c>
/// just before a beat label is its QRS onset and the <c>)</c> just after it its QRS end; a <c>p</c> before marks its P
/// peak (with its own <c>(</c> <c>)</c>); the <c>)</c> after the following <c>t</c> is the T end.
/// </summary>
public sealed class QtdbFixture
{
    public QtdbFixture()
    {
        var names = SharedData.Records("qtdb");
        var records = new QtdbRecord[names.Count];
        Parallel.For(0, names.Count, new ParallelOptions { MaxDegreeOfParallelism = 2 }, i => records[i] = Load(names[i]));
        Records = records;
    }

    internal IReadOnlyList<QtdbRecord> Records { get; }

    private static QtdbRecord Load(string name)
    {
        var record = ReferenceRecord.Load("qtdb", name, "q1c");
        var beats = Parse(record.Annotations);
        var conditioned = DelineationRun.Condition(record.Leads, record.SamplingRateHz);
        var results = DelineationRun.Run(conditioned, record.SamplingRateHz, beats.Select(b => b.Sample).ToArray(), maxNeighbourS: 2.0);
        return new QtdbRecord(name, record.SamplingRateHz, beats, results);
    }

    private static QtdbBeat[] Parse(IReadOnlyList<WfdbAnnotation> a)
    {
        var list = new List<QtdbBeat>();
        for (var i = 0; i < a.Count; i++)
        {
            if (!a[i].IsBeat)
            {
                continue;
            }

            long? onset = i > 0 && a[i - 1].Mnemonic == "(" ? a[i - 1].Sample : null;
            long? offset = i + 1 < a.Count && a[i + 1].Mnemonic == ")" ? a[i + 1].Sample : null;

            // Before the beat: p ) ( beat.
            var j = i - 1;
            if (j >= 0 && a[j].Mnemonic == "(")
            {
                j--;
            }

            if (j >= 0 && a[j].Mnemonic == ")")
            {
                j--;
            }

            long? pPeak = j >= 0 && a[j].Mnemonic == "p" ? a[j].Sample : null;

            // After the beat: beat ) ( t ).
            var k = i + 1;
            if (k < a.Count && a[k].Mnemonic == ")")
            {
                k++;
            }

            if (k < a.Count && a[k].Mnemonic == "(")
            {
                k++;
            }

            long? tEnd = k + 1 < a.Count && a[k].Mnemonic == "t" && a[k + 1].Mnemonic == ")" ? a[k + 1].Sample : null;
            list.Add(new QtdbBeat(a[i].Sample, a[i].Mnemonic, onset, offset, pPeak, tEnd));
        }

        return list.ToArray();
    }
}

internal sealed record QtdbRecord(string Name, double SamplingRateHz, QtdbBeat[] Beats, DelineatedBeat[] Results);

internal readonly record struct QtdbBeat(long Sample, string Label, long? QrsOnset, long? QrsOffset, long? PPeak, long? TEnd);
