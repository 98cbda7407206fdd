using LongRecord.Analysis.Quality;
using LongRecord.Analysis.Tests.Support;
using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;
using Xunit.Abstractions;

namespace LongRecord.Analysis.Tests.Quality;

/// <summary>
/// MIT-BIH Supraventricular Arrhythmia Database (128 Hz; the local development subset of 39 records): figures for information, as for MITDB, and one
/// check — its reference annotations mark no ventricular flutter or fibrillation, so no window may be chaotic.
/// </summary>
public sealed class SvdbQualityTests(ITestOutputHelper output)
{
    [Fact]
    public void AllRecords_BeatsInUnanalysableWindowsReported_NoChaoticWindowWithoutFlutterMarks()
    {
        long beats = 0, excluded = 0, seconds = 0, analysable = 0;
        var records = SharedData.Records("svdb");
        foreach (var name in records)
        {
            var record = ReferenceRecord.Load("svdb", name);
            Assert.DoesNotContain(record.Annotations, a => a.Code is WfdbAnnotationCode.VentricularFlutterStart or WfdbAnnotationCode.VentricularFlutterWave);
            var windows = QualityRun.Windows(record);
            long b = 0, e = 0;
            foreach (var a in record.Annotations.Where(a => a.IsBeat))
            {
                b++;
                e += windows[QualityRun.WindowOf(a.Sample, record.SamplingRateHz)].Analysable ? 0 : 1;
            }

            var ok = windows.Count(w => w.Analysable);
            if (e > 0 || ok < windows.Count)
            {
                output.WriteLine(FormattableString.Invariant($"{name}: analysable {100.0 * ok / windows.Count:F2} %, {e} of {b} beats in unanalysable windows ({100.0 * e / b:F3} %)"));
            }

            Assert.DoesNotContain(windows, w => w.Reason == QualityReason.ChaoticAllLeads);
            beats += b;
            excluded += e;
            seconds += windows.Count;
            analysable += ok;
        }

        output.WriteLine(FormattableString.Invariant(
            $"{records.Count} records, all others fully analysable; pooled: {excluded} of {beats} beats in unanalysable windows ({100.0 * excluded / beats:F3} %), analysable {100.0 * analysable / seconds:F2} % of the time"));
        // The folder's README: 39 records holding 91,575 beat annotations.
        Assert.Equal(39, records.Count);
        Assert.Equal(91575, beats);
    }
}
