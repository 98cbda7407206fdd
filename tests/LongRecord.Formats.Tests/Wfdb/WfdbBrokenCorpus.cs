using System.Text;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Wfdb;

/// <summary>
/// Broken WFDB files made from a good small record and a good annotation file, each with the message fragment and
/// byte offset the reader must report. Convention for the aggregate test: a <see cref="BrokenFile.FileName"/> ending
/// in <c>.hea</c> is opened as a record (<c>WfdbRecordReader.Open</c>); any other extension (<c>.atr</c>) is an
/// annotation file, opened with <c>WfdbAnnotationReader.Read</c>.
/// </summary>
public static class WfdbBrokenCorpus
{
    private const string GoodHeader =
        "rec 2 360 10\n" +
        "rec.dat 212 200(1024) 11 1024 0 0 0 MLII\n" +
        "rec.dat 212 200(1024) 11 1024 0 0 0 V1\n" +
        "# made for the broken-file corpus\n";

    public static IEnumerable<BrokenFile> Build()
    {
        var dat = GoodSignal(10);
        var side = new Dictionary<string, byte[]> { ["rec.dat"] = dat };

        yield return Header("wfdb-unknown-format-code", GoodHeader.Replace("rec.dat 212 200(1024) 11 1024 0 0 0 V1", "rec.dat 999 200(1024) 11 1024 0 0 0 V1"),
            "header line 3: unknown signal format code 999", h => h.IndexOf("999", StringComparison.Ordinal), side);
        yield return Header("wfdb-sampling-frequency-not-a-number", GoodHeader.Replace("rec 2 360 10", "rec 2 36O 10"),
            "record line: sampling frequency is not a number ('36O')", h => h.IndexOf("36O", StringComparison.Ordinal), side);
        yield return Header("wfdb-gain-not-a-number", GoodHeader.Replace("212 200(1024) 11 1024 0 0 0 MLII", "212 2x0 11 1024 0 0 0 MLII"),
            "header line 2: ADC gain is not a number ('2x0')", h => h.IndexOf("2x0", StringComparison.Ordinal), side);
        yield return Header("wfdb-baseline-not-an-integer", GoodHeader.Replace("200(1024) 11 1024 0 0 0 V1", "200(10.5) 11 1024 0 0 0 V1"),
            "baseline is not an integer in parentheses ('(10.5)')", h => h.IndexOf("(10.5)", StringComparison.Ordinal), side);
        yield return Header("wfdb-signal-count-exceeds-signal-lines", GoodHeader.Replace("rec 2 360 10", "rec 3 360 10"),
            "number of signals is 3 but the header has 2 signal specification lines", _ => 4, side);
        yield return Header("wfdb-declared-length-exceeds-signal-file", GoodHeader.Replace("rec 2 360 10", "rec 2 360 20"),
            "signal file 'rec.dat' holds 10 frames (30 bytes), fewer than the 20 samples per signal", _ => 10, side);
        yield return Header("wfdb-signal-file-truncated", GoodHeader,
            "signal file 'rec.dat' ends inside frame 9 (29 bytes)", _ => 10, new Dictionary<string, byte[]> { ["rec.dat"] = dat[..29] });
        yield return Header("wfdb-multi-segment-record", "multi/3 2 360 45000\nrec_a 21600\nrec_b 1800\nrec_a 21600\n",
            "multi-segment records are not supported", _ => 0, null);
        yield return Header("wfdb-signal-from-standard-input", GoodHeader.Replace("rec.dat 212 200(1024) 11 1024 0 0 0 V1", "- 212 200(1024) 11 1024 0 0 0 V1"),
            "header line 3: signal file '-' (standard input) is not supported", h => h.IndexOf("- 212", StringComparison.Ordinal), side);
        yield return Header("wfdb-signal-skew", GoodHeader.Replace("rec.dat 212 200(1024) 11 1024 0 0 0 V1", "rec.dat 212:3 200(1024) 11 1024 0 0 0 V1"),
            "signal skew (:3) is not supported", h => h.IndexOf("rec.dat 212:3", StringComparison.Ordinal), side);
        yield return Header("wfdb-base-date-impossible", GoodHeader.Replace("rec 2 360 10", "rec 2 360 10 9:30:00 31/02/2003"),
            "record line: base date is not DD/MM/YYYY ('31/02/2003')", h => h.IndexOf("31/02", StringComparison.Ordinal), side);
        yield return Header("wfdb-no-record-line", "# only a comment\n\n# and another\n",
            "no record line", h => h.Length, null);
        yield return Header("wfdb-negative-signal-count", GoodHeader.Replace("rec 2 360 10", "rec -2 360 10"),
            "number of signals is not a non-negative integer ('-2')", _ => 4, side);
        yield return new BrokenFile("wfdb-absent-signal-file-read", "rec.hea", Ascii(GoodHeader),
            "cannot read samples: no signal file (rec.dat)", null, null, FailsOnRead: true);

        var atr = GoodAnnotations();
        yield return new BrokenFile("wfdb-annotation-odd-length", "rec.atr", atr[..^3],
            "file ends inside an annotation word (odd number of bytes)", atr.Length - 4);
        yield return new BrokenFile("wfdb-annotation-no-end-marker", "rec.atr", atr[..^2],
            "file ends without the end-of-file marker", atr.Length - 2);

        // AUX saying 5 bytes with only 2 of them present.
        byte[] auxCut = [.. atr[..^2], .. Word(63, 5), (byte)'(', (byte)'A'];
        yield return new BrokenFile("wfdb-annotation-aux-cut-short", "rec.atr", auxCut,
            "file ends inside the 5-byte text of an AUX word", atr.Length);

        // SKIP followed by one word of its two-word interval.
        byte[] skipCut = [.. atr[..^2], .. Word(59, 0), 0x01, 0x00];
        yield return new BrokenFile("wfdb-annotation-skip-cut-short", "rec.atr", skipCut,
            "file ends inside the 4-byte interval of a SKIP word", atr.Length);

        byte[] subFirst = [.. Word(61, 2), .. atr];
        yield return new BrokenFile("wfdb-annotation-sub-before-any-annotation", "rec.atr", subFirst,
            "SUB word with no annotation before it", 0);
    }

    private static BrokenFile Header(string name, string text, string problem, Func<string, int> offset, Dictionary<string, byte[]>? side) =>
        new(name, "rec.hea", Ascii(text), problem, offset(text), side);

    private static byte[] Ascii(string text) => Encoding.ASCII.GetBytes(text);

    /// <summary>Format 212, two signals: frame f holds f and −f (signal(5), written out by hand).</summary>
    private static byte[] GoodSignal(int frames)
    {
        var stream = new int[2 * frames];
        for (var f = 0; f < frames; f++)
        {
            stream[2 * f] = f;
            stream[2 * f + 1] = -f;
        }

        return WfdbHandEncoder.Encode(212, stream);
    }

    /// <summary>Rhythm (N at 10 with AUX, N at 300, V at 660 with NUM 1, end (annotation(5), written word by word).</summary>
    private static byte[] GoodAnnotations() =>
    [
        .. Word(28, 10), .. Word(63, 2), (byte)'(', (byte)'N',
        .. Word(1, 290),
        .. Word(5, 360), .. Word(60, 1),
        .. Word(0, 0),
    ];

    private static byte[] Word(int code, int field) => [(byte)(((code << 10) | field) & 0xFF), (byte)(((code << 10) | field) >> 8)];
}
