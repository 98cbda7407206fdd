using System.Collections.Concurrent;
using LongRecord.Analysis.Rhythm;
using LongRecord.TestSupport;
using Xunit.Abstractions;

namespace LongRecord.Analysis.Tests.Rhythm;

/// <summary>
/// AF detection on the Long Term AF Database (PhysioNet ltafdb, the 42 development records present), beats from each
/// record's unaudited .qrs detector output (unlabelled: RR rules only), reference rhythm from its .atr.
/// Anchors (published abstracts): Zhou et al. 2015, Se 96.1 %, Sp 95.7 % on LTAFDB; Petrėnas et al. 2015, Se 97.1 %,
/// Sp 98.3 % on the MIT-BIH AF database.
/// </summary>
public sealed class LtafdbAfTests(ITestOutputHelper output)
{
    [Fact]
    public void Ltafdb_QrsBeats_AfDurationSensitivityPredictivitySpecificityAndBurden()
    {
        var records = SharedData.Records("ltafdb");
        Assert.Equal(42, records.Count);
        var scores = new ConcurrentBag<AfScore>();
        Parallel.ForEach(records, record =>
        {
            var header = AnnotationBeats.Header("ltafdb", record);
            var fs = header.SamplingFrequencyHz;
            var beats = AnnotationBeats.Read(AnnotationBeats.Annotations("ltafdb", record, "qrs"), labelled: false);
            var reference = AnnotationBeats.Annotations("ltafdb", record, "atr");
            var input = new RhythmInput
            {
                Beats = beats,
                ReferenceRateHz = fs,
                DurationS = (header.SamplesPerSignal ?? beats[^1].Sample) / fs,
            };
            var result = RhythmAnalyser.Analyse(input);
            var times = beats.Select(b => b.Sample / fs).ToArray();
            scores.Add(AfScore.Score(record, reference, fs, times, result.Episodes));
        });

        var ordered = scores.OrderBy(s => s.Record, StringComparer.Ordinal).ToList();
        foreach (var s in ordered)
        {
            output.WriteLine(s.ToString());
        }

        var pooled = AfScore.Pool(ordered);
        var errors = ordered.Select(s => Math.Abs(s.OurBurden - s.ReferenceBurden) * 100).OrderBy(e => e).ToArray();
        var median = errors.Length % 2 == 1 ? errors[errors.Length / 2] : 0.5 * (errors[errors.Length / 2 - 1] + errors[errors.Length / 2]);
        output.WriteLine(pooled.ToString());
        output.WriteLine($"median |burden error| {median:F2} percentage points");
        Assert.True(pooled.Sensitivity >= 0.95, $"Se {pooled.Sensitivity:P2}");
        Assert.True(pooled.PositivePredictivity >= 0.93, $"+P {pooled.PositivePredictivity:P2}");
        Assert.True(pooled.Specificity >= 0.95, $"Sp {pooled.Specificity:P2}");
        Assert.True(median <= 2.0, $"median burden error {median:F2} pp");
    }
}
