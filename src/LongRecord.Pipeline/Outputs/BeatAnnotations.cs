using LongRecord.Analysis.Beats;
using LongRecord.Formats.Wfdb;

namespace LongRecord.Pipeline.Outputs;

/// <summary>
/// The beats as a WFDB (MIT-format) annotation file, annotator <c>beats</c>, so any WFDB viewer shows them over the
/// record: class N as N, S as S, V as V, F as F, Q as Q (the EC57 class names are also WFDB beat codes).
/// </summary>
public static class BeatAnnotations
{
    public const string Annotator = "beats";

    public static void Write(string path, IReadOnlyList<Beat> beats) =>
        WfdbAnnotationWriter.Write(path, beats.Select(b => new WfdbAnnotation(b.Sample, CodeOf(b.Class))));

    public static WfdbAnnotationCode CodeOf(BeatClass c) =>
        WfdbAnnotationCodes.FromMnemonic(BeatsCsv.ClassCode(c).ToString()) ?? throw new InvalidOperationException($"no WFDB code for {c}");
}
