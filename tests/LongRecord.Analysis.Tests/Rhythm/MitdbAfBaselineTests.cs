using System.Collections.Concurrent;
using LongRecord.Analysis.Rhythm;
using LongRecord.TestSupport;
using Xunit.Abstractions;

namespace LongRecord.Analysis.Tests.Rhythm;

/// <summary>
/// AF on the MIT-BIH Arrhythmia Database (PhysioNet mitdb, all 48 records), reference rhythm from .atr. The product
/// check (Se ≥ 90 %, Sp ≥ 92 % on detected beats with P waves from the delineator) needs the integrated beats stage;
/// until then this runs the detector on the .atr beats with their reviewed labels and PWave = −1 (RR only) and
/// measures the baseline. Anchor: RR-only detectors fall to Sp 87–91 % on MITDB (the anchors).
/// </summary>
public sealed class MitdbAfBaselineTests(ITestOutputHelper output)
{
    [Fact]
    public void Mitdb_AtrBeatsRrOnly_AfDurationBaseline()
    {
        var records = SharedData.Records("mitdb");
        Assert.Equal(48, records.Count);
        var scores = new ConcurrentBag<AfScore>();
        Parallel.ForEach(records, record =>
        {
            var header = AnnotationBeats.Header("mitdb", record);
            var fs = header.SamplingFrequencyHz;
            var atr = AnnotationBeats.Annotations("mitdb", record, "atr");
            var beats = AnnotationBeats.Read(atr, labelled: true);
            var result = RhythmAnalyser.Analyse(new RhythmInput
            {
                Beats = beats,
                ReferenceRateHz = fs,
                DurationS = (header.SamplesPerSignal ?? beats[^1].Sample) / fs,
            });
            scores.Add(AfScore.Score(record, atr, fs, beats.Select(b => b.Sample / fs).ToArray(), result.Episodes));
        });

        foreach (var s in scores.Where(s => s.ReferenceAfS > 0 || s.OurAfS > 0).OrderBy(s => s.Record, StringComparer.Ordinal))
        {
            output.WriteLine(s.ToString());
        }

        var pooled = AfScore.Pool(scores);
        output.WriteLine(pooled.ToString());
        // The sensitivity target does not depend on atrial evidence (it only relaxes the RR criteria); specificity
        // is reported, to be checked at 92 % once P waves are connected.
        Assert.True(pooled.Sensitivity >= 0.90, $"Se {pooled.Sensitivity:P2}");
    }
}
