using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;

namespace LongRecord.Analysis.Tests.Support;

/// <summary>A PhysioNet record read whole into memory for a test, with one of its annotation files.</summary>
public sealed record ReferenceRecord(string Database, string Name, double SamplingRateHz, string[] Labels, float[][] Leads, IReadOnlyList<WfdbAnnotation> Annotations)
{
    public long SampleCount => Leads[0].Length;

    /// <summary>Loads <paramref name="record"/> of <paramref name="database"/> (in ../shared/data/physionet) with annotator <paramref name="annotator"/>.</summary>
    public static ReferenceRecord Load(string database, string record, string annotator = "atr") => Read(database, record, annotator);

    /// <summary>The leads laid out lead after lead (lead k at k × count) for samples start … start + count − 1.</summary>
    public void CopyBlock(long start, int count, Span<float> destination)
    {
        for (var k = 0; k < Leads.Length; k++)
        {
            Leads[k].AsSpan((int)start, count).CopyTo(destination.Slice(k * count, count));
        }
    }

    private static ReferenceRecord Read(string database, string record, string annotator)
    {
        var folder = SharedData.Physionet(database);
        var hea = SharedData.Path(Path.Combine("physionet", database, record + ".hea"));
        using var reader = WfdbRecordReader.Open(hea);
        var channels = reader.Info.Channels;
        var leads = new float[channels.Count][];
        for (var k = 0; k < channels.Count; k++)
        {
            leads[k] = new float[channels[k].SampleCount];
            reader.Read(k, 0, leads[k]);
        }

        var annPath = Path.Combine(folder, record + "." + annotator);
        var annotations = File.Exists(annPath) ? WfdbAnnotationReader.Read(annPath) : throw new SharedDataMissingException($"shared reference data missing: {annPath}");
        return new ReferenceRecord(database, record, channels[0].SamplingRateHz, channels.Select(c => c.Label).ToArray(), leads, annotations);
    }
}
