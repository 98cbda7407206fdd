using System.Diagnostics;
using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Beats.Classification;
using LongRecord.Analysis.Conditioning;
using LongRecord.Analysis.Tests.Support;

namespace LongRecord.Analysis.Tests.Classification;

/// <summary>
/// The product's path for one record: condition every lead, find beats with <see cref="QrsDetector"/>, then classify
/// each beat from its conditioned window (0.5 s before to 0.7 s after the fiducial).
/// </summary>
internal static class ClassifierRun
{
    public sealed record Result(string Record, double Fs, int Detections, List<(long Sample, BeatClass Class)> Beats, long[,] Confusion, TimeSpan ClassifierTime);

    public static Result Run(ReferenceRecord record, ClassificationSettings? settings = null)
    {
        var fs = record.SamplingRateHz;
        var leads = record.Leads.Select(l => (float[])l.Clone()).ToArray();
        foreach (var lead in leads)
        {
            new EcgConditioner(fs).Process(lead);
        }

        var detector = new QrsDetector(fs, leads.Length);
        var n = leads[0].Length;
        var blockLength = (int)fs * 10;
        var block = new float[leads.Length * blockLength];
        for (var start = 0; start < n; start += blockLength)
        {
            var count = Math.Min(blockLength, n - start);
            for (var k = 0; k < leads.Length; k++)
            {
                leads[k].AsSpan(start, count).CopyTo(block.AsSpan(k * count, count));
            }

            detector.Process(block, count);
        }

        detector.Flush();

        var before = (int)Math.Round(0.5 * fs);
        var after = (int)Math.Round(0.7 * fs);
        var window = new float[leads.Length * (before + after + 1)];
        var classifier = new BeatClassifier(fs, leads.Length, settings);
        var beats = new List<(long, BeatClass)>(detector.Detections.Count);
        var watch = new Stopwatch();
        foreach (var fiducial in detector.Detections)
        {
            var from = (int)Math.Max(0, fiducial - before);
            var to = (int)Math.Min(n - 1, fiducial + after);
            var length = to - from + 1;
            for (var k = 0; k < leads.Length; k++)
            {
                leads[k].AsSpan(from, length).CopyTo(window.AsSpan(k * length, length));
            }

            watch.Start();
            classifier.Add(fiducial, window, length, (int)(fiducial - from), BeatMeasurements.Unknown);
            while (classifier.TryTake(out var b))
            {
                beats.Add((b.Sample, b.Class));
            }

            watch.Stop();
        }

        classifier.Flush();
        while (classifier.TryTake(out var b))
        {
            beats.Add((b.Sample, b.Class));
        }

        return new Result(record.Name, fs, detector.Detections.Count, beats, Ec57Scoring.Compare(record.Annotations, beats, fs), watch.Elapsed);
    }
}
