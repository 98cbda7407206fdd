using System.Globalization;
using LongRecord.Analysis.Beats;
using LongRecord.Formats;
using LongRecord.Formats.Wfdb;

namespace LongRecord.Pipeline.Inputs;

/// <summary>
/// Beats taken from an existing annotation file instead of being detected (<c>--beats EXT|PATH</c>): a WFDB annotator
/// beside the record's header (<c>qrs</c>, <c>atr</c>, <c>ecg</c>…), a WFDB annotation file by path, or a CSV of R times.
/// Only beat codes are beats (EC57's list); rhythm, noise and other marks are not. A reviewed annotator keeps each
/// beat's EC57 class; a detector's output (all beats <c>N</c>, such as <c>qrs</c>) and a CSV of times are unlabelled.
/// </summary>
public sealed record ExternalBeats(IReadOnlyList<long> Samples, IReadOnlyList<BeatClass>? Classes, string Source, long LastAnnotationSample)
{
    // Annotators written by people (reference annotations), whose labels are kept (PhysioNet's ANNOTATORS files).
    private static readonly HashSet<string> s_reviewed = new(StringComparer.OrdinalIgnoreCase) { "atr", "ecg", "man", "q1c", "q2c" };

    // Annotators written by detectors: their N labels say nothing about the beat's origin.
    private static readonly HashSet<string> s_detectors = new(StringComparer.OrdinalIgnoreCase) { "qrs", "sqrs", "wqrs", "gqrs", "jqrs", "beats" };

    public bool Labelled => Classes is not null;

    /// <summary>Resolves <paramref name="spec"/> for the recording at <paramref name="recordingPath"/> and reads it.</summary>
    /// <param name="referenceRateHz">Samples per second of the recording's sample axis (for a CSV of times).</param>
    public static ExternalBeats Load(string spec, string recordingPath, double referenceRateHz)
    {
        var path = File.Exists(spec) ? spec : Path.ChangeExtension(recordingPath, spec.TrimStart('.'));
        if (!File.Exists(path))
        {
            throw new RecordingFormatException(path, $"beat annotation file not found (--beats {spec})");
        }

        return path.EndsWith(".csv", StringComparison.OrdinalIgnoreCase)
            ? FromCsv(path, referenceRateHz)
            : FromWfdb(path);
    }

    private static ExternalBeats FromWfdb(string path)
    {
        var samples = new List<long>();
        var classes = new List<BeatClass>();
        long last = 0;
        var allNormal = true;
        foreach (var a in WfdbAnnotationReader.Enumerate(path))
        {
            last = Math.Max(last, a.Sample);
            if (!a.IsBeat)
            {
                continue;
            }

            var c = ClassOf(a.Mnemonic[0]);
            allNormal &= a.Code == WfdbAnnotationCode.Normal;
            samples.Add(a.Sample);
            classes.Add(c);
        }

        var annotator = Path.GetExtension(path).TrimStart('.');
        var labelled = s_reviewed.Contains(annotator) || (!s_detectors.Contains(annotator) && !allNormal);
        return new ExternalBeats(samples, labelled ? classes : null, path, last);
    }

    // A CSV of R times: a header naming a column "time_s" (seconds) or "sample", or one column of seconds without header.
    private static ExternalBeats FromCsv(string path, double referenceRateHz)
    {
        var samples = new List<long>();
        var lines = File.ReadLines(path).Select((l, i) => (Text: l.Trim(), Line: i + 1)).Where(x => x.Text.Length > 0 && !x.Text.StartsWith('#')).ToList();
        var column = 0;
        var isSample = false;
        var first = 0;
        if (lines.Count > 0 && !double.TryParse(lines[0].Text.Split(',')[0], NumberStyles.Float, CultureInfo.InvariantCulture, out _))
        {
            var names = lines[0].Text.Split(',').Select(n => n.Trim().ToLowerInvariant()).ToArray();
            column = Array.FindIndex(names, n => n is "time_s" or "time" or "r_time_s" or "sample");
            if (column < 0)
            {
                throw new RecordingFormatException(path, "beat times CSV needs a column named time_s or sample", 0);
            }

            isSample = names[column] == "sample";
            first = 1;
        }

        long previous = -1;
        for (var i = first; i < lines.Count; i++)
        {
            var cells = lines[i].Text.Split(',');
            if (column >= cells.Length || !double.TryParse(cells[column], NumberStyles.Float, CultureInfo.InvariantCulture, out var v) || v < 0)
            {
                throw new RecordingFormatException(path, $"line {lines[i].Line}: not a beat time ('{lines[i].Text}')");
            }

            var s = isSample ? (long)v : (long)Math.Round(v * referenceRateHz, MidpointRounding.AwayFromZero);
            if (s <= previous)
            {
                throw new RecordingFormatException(path, $"line {lines[i].Line}: beat times must increase");
            }

            samples.Add(s);
            previous = s;
        }

        return new ExternalBeats(samples, null, path, previous);
    }

    private static BeatClass ClassOf(char code) => code switch
    {
        'N' or 'L' or 'R' or 'e' or 'j' or 'B' => BeatClass.N,
        'A' or 'a' or 'J' or 'S' => BeatClass.S,
        'V' or 'E' or 'r' => BeatClass.V,
        'F' => BeatClass.F,
        _ => BeatClass.Q,
    };
}
