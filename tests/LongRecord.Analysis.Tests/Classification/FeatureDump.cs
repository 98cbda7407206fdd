using System.Globalization;
using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Beats.Classification;
using LongRecord.Analysis.Conditioning;
using LongRecord.Analysis.Tests.Support;
using LongRecord.TestSupport;

namespace LongRecord.Analysis.Tests.Classification;

// Development aid: dumps per-beat features with the nearest reference label when LONGRECORD_DUMP names a file.
public sealed class FeatureDump
{
    [Fact]
    public void DumpWhenAsked()
    {
        var path = Environment.GetEnvironmentVariable("LONGRECORD_DUMP");
        if (string.IsNullOrEmpty(path))
        {
            return;
        }

        var db = Environment.GetEnvironmentVariable("LONGRECORD_DUMP_DB") ?? "mitdb";
        using var w = new StreamWriter(path);
        w.WriteLine("rec,sample,ref,rhythm,cls,valid,tmpl,isnorm,corr,amp,width,extra,noise,rrprev,rrnext,local,irr,atr,nnoise");
        foreach (var name in SharedData.Records(db))
        {
            var rec = ReferenceRecord.Load(db, name);
            var fs = rec.SamplingRateHz;
            var refs = rec.Annotations.Where(a => a.IsBeat).ToArray();
            var rhythmAt = rec.Annotations.Where(a => a.Code == LongRecord.Formats.Wfdb.WfdbAnnotationCode.RhythmChange).ToArray();
            var leads = rec.Leads.Select(l => (float[])l.Clone()).ToArray();
            foreach (var lead in leads)
            {
                new EcgConditioner(fs).Process(lead);
            }

            var detector = new QrsDetector(fs, leads.Length);
            var n = leads[0].Length;
            var block = new float[leads.Length * n];
            for (var k = 0; k < leads.Length; k++)
            {
                leads[k].CopyTo(block.AsSpan(k * n, n));
            }

            detector.Process(block, n);
            detector.Flush();
            var classifier = new BeatClassifier(fs, leads.Length);
            classifier.Trace = (p, rrNext, local, irr, cls) =>
            {
                var i = Array.BinarySearch(refs.Select(r => r.Sample).ToArray(), p.Sample);
                if (i < 0)
                {
                    i = ~i;
                }

                string label = "-";
                long best = (long)(0.15 * fs) + 1;
                for (var j = Math.Max(0, i - 1); j <= Math.Min(refs.Length - 1, i); j++)
                {
                    if (Math.Abs(refs[j].Sample - p.Sample) < best)
                    {
                        best = Math.Abs(refs[j].Sample - p.Sample);
                        label = refs[j].Mnemonic;
                    }
                }

                var rh = rhythmAt.LastOrDefault(a => a.Sample <= p.Sample).Aux ?? "";
                w.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"{name},{p.Sample},{label},{rh.Trim('\0', '(')},{cls},{(p.Valid ? 1 : 0)},{p.Template},{(p.IsNormalTemplate ? 1 : 0)},{p.CorrelationToNormal:F3},{p.AmplitudeToNormal:F3},{p.WidthMs:F1},{p.ExtraWidthMs:F1},{p.Noise:F3},{p.RrPrevS:F3},{rrNext:F3},{local:F3},{irr:F4},{p.AtrialCorrelation:F3},{p.NormalNoise:F3}"));
            };
            var before = (int)Math.Round(0.5 * fs);
            var after = (int)Math.Round(0.7 * fs);
            var window = new float[leads.Length * (before + after + 1)];
            foreach (var fiducial in detector.Detections)
            {
                var from = (int)Math.Max(0, fiducial - before);
                var to = (int)Math.Min(n - 1, fiducial + after);
                var length = to - from + 1;
                for (var k = 0; k < leads.Length; k++)
                {
                    leads[k].AsSpan(from, length).CopyTo(window.AsSpan(k * length, length));
                }

                classifier.Add(fiducial, window, length, (int)(fiducial - from), BeatMeasurements.Unknown);
                while (classifier.TryTake(out _))
                {
                }
            }

            classifier.Flush();
        }
    }
}
