using LongRecord.Analysis.Tests.Support;
using LongRecord.Formats.Wfdb;

namespace LongRecord.Analysis.Tests.Delineation;

/// <summary>
/// An MIT-BIH Arrhythmia Database record (mitdb, 360 Hz) with every reference beat delineated in order, the beat's
/// annotated sample as its fiducial, and the rhythm each beat lies in (from the <c>+</c> rhythm annotations' aux text).
/// </summary>
internal sealed record MitdbRecordRun(string Name, double SamplingRateHz, WfdbAnnotation[] Beats, string[] Rhythms, DelineatedBeat[] Results)
{
    public static MitdbRecordRun Load(string name)
    {
        var record = ReferenceRecord.Load("mitdb", name);
        var beats = new List<WfdbAnnotation>();
        var rhythms = new List<string>();
        var rhythm = "";
        foreach (var a in record.Annotations)
        {
            if (a.RhythmText is string t)
            {
                rhythm = t;
            }

            if (a.IsBeat)
            {
                beats.Add(a);
                rhythms.Add(rhythm);
            }
        }

        var conditioned = DelineationRun.Condition(record.Leads, record.SamplingRateHz);
        var results = DelineationRun.Run(conditioned, record.SamplingRateHz, beats.Select(b => b.Sample).ToArray());
        return new MitdbRecordRun(name, record.SamplingRateHz, beats.ToArray(), rhythms.ToArray(), results);
    }
}
