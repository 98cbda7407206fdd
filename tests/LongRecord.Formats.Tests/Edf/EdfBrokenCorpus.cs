using System.Text;
using LongRecord.Formats.Edf;
using LongRecord.TestSupport;

namespace LongRecord.Formats.Tests.Edf;

/// <summary>
/// Broken EDF/BDF files made from good ones written by <see cref="EdfWriter"/>, each with the message fragment and byte
/// offset the reader must report. Offsets come from the EDF header layout (EDF spec): with ns = 3 signals the per-signal
/// fields start at 256 (label), 304 (transducer), 544 (unit), 568 (physical min), 592 (physical max), 616 (digital min),
/// 640 (digital max), 664 (prefiltering), 904 (samples per record), 928 (reserved); signal i's field is at start + i × width.
/// </summary>
public static class EdfBrokenCorpus
{
    private const int Ns = 3;
    private const int HeaderBytes = 256 * (Ns + 1);
    private const int Records = 10;
    private const int Samples = 50;

    // EDF: 2 channels × 50 samples × 2 bytes + 64 annotation bytes; BDF: × 3 bytes + 66 (22 three-byte samples).
    private const int EdfRecordBytes = 2 * Samples * 2 + 64;
    private const int BdfRecordBytes = 2 * Samples * 3 + 66;
    private const int EdfAnnotationOffset = 2 * Samples * 2;

    public static IEnumerable<BrokenFile> Build()
    {
        var edf = Good(bdf: false);
        var bdf = Good(bdf: true);

        yield return new("edf-truncated-fixed-header", "a.edf", edf[..200],
            "file is shorter than its header declares (the fixed header alone is 256 bytes, the file has 200)", 200);
        yield return new("edf-truncated-signal-headers", "a.edf", edf[..700],
            "file is shorter than its header declares (3 signals need 1024 header bytes, the file has 700)", 700);
        yield return new("edf-truncated-mid-record", "a.edf", edf[..(HeaderBytes + 4 * EdfRecordBytes + 100)],
            $"declared 10 data records of {EdfRecordBytes} bytes but the file holds 4 and ends 100 bytes into data record 5", HeaderBytes + 4 * EdfRecordBytes);
        yield return new("edf-missing-records", "a.edf", edf[..(HeaderBytes + 7 * EdfRecordBytes)],
            $"declared 10 data records of {EdfRecordBytes} bytes but the file holds 7", HeaderBytes + 7 * EdfRecordBytes);
        yield return new("edf-unknown-count-partial-record", "a.edf", Patch(edf[..(HeaderBytes + 6 * EdfRecordBytes + 10)], 236, 8, "-1"),
            "number of data records is -1 (unknown) and the file ends 10 bytes into data record 7", HeaderBytes + 6 * EdfRecordBytes);

        yield return new("edf-records-not-a-number", "a.edf", Patch(edf, 236, 8, "12a"),
            "header field 'number of data records' is not a number ('12a')", 236);
        yield return new("edf-duration-not-a-number", "a.edf", Patch(edf, 244, 8, "1,0"),
            "header field 'duration of a data record' is not a number ('1,0')", 244);
        yield return new("edf-signals-not-a-number", "a.edf", Patch(edf, 252, 4, "3x"),
            "header field 'number of signals' is not a number ('3x')", 252);
        yield return new("edf-header-bytes-not-a-number", "a.edf", Patch(edf, 184, 8, "1O24"),
            "header field 'number of bytes in header record' is not a number ('1O24')", 184);
        yield return new("edf-physical-min-not-a-number", "a.edf", Patch(edf, 568 + 8, 8, "abc"),
            "signal 2 'ECG II': field 'physical minimum' is not a number ('abc')", 576);
        yield return new("edf-samples-not-a-number", "a.edf", Patch(edf, 904, 8, "5O"),
            "signal 1 'ECG I': field 'nr of samples in each data record' is not a number ('5O')", 904);

        yield return new("edf-header-bytes-mismatch", "a.edf", Patch(edf, 184, 8, "1280"),
            "header field 'number of bytes in header record' is 1280 but 3 signals need 256 × (3 + 1) = 1024", 184);
        yield return new("edf-zero-signals", "a.edf", Patch(edf, 252, 4, "0"),
            "header field 'number of signals' is 0: the file holds no signal", 252);
        yield return new("edf-digital-min-equals-max", "a.edf", Patch(edf, 616 + 8, 8, "32767"),
            "signal 2 'ECG II': digital minimum equals digital maximum (32767)", 624);
        yield return new("edf-digital-min-above-max", "a.edf", Patch(Patch(edf, 616, 8, "100"), 640, 8, "-100"),
            "signal 1 'ECG I': digital minimum (100) is greater than digital maximum (-100)", 616);
        yield return new("edf-physical-min-equals-max", "a.edf", Patch(edf, 592, 8, "-5"),
            "signal 1 'ECG I': physical minimum equals physical maximum (-5)", 568);
        yield return new("edf-digital-max-out-of-range", "a.edf", Patch(edf, 640, 8, "40000"),
            "signal 1 'ECG I': digital maximum 40000 is outside the 16-bit range -32768…32767", 640);
        yield return new("edf-negative-samples-per-record", "a.edf", Patch(edf, 904, 8, "-50"),
            "signal 1 'ECG I': field 'nr of samples in each data record' must be positive (-50)", 904);
        yield return new("edf-negative-record-count", "a.edf", Patch(edf, 236, 8, "-5"),
            "header field 'number of data records' is negative (-5); only -1 (unknown) is allowed", 236);
        yield return new("edf-negative-duration", "a.edf", Patch(edf, 244, 8, "-1"),
            "header field 'duration of a data record' is negative (-1 s)", 244);
        yield return new("edf-startdate-invalid", "a.edf", Patch(edf, 168, 8, "31.02.24"),
            "header field 'startdate' is not a valid date ('31.02.24')", 168);
        yield return new("edf-starttime-invalid", "a.edf", Patch(edf, 176, 8, "25.00.00"),
            "header field 'starttime' is not a time hh.mm.ss ('25.00.00')", 176);

        // TALs (EDF+ 2.2.2). Record r's annotation signal starts at header + (r − 1) × record size + 200.
        var tal3 = HeaderBytes + 2 * EdfRecordBytes + EdfAnnotationOffset;
        yield return new("edf-tal-onset-without-sign", "a.edf", Patch(edf, tal3, 1, "x"),
            "bad TAL in data record 3: onset must begin with '+' or '-' (found 'x')", tal3);
        var tal2 = HeaderBytes + EdfRecordBytes + EdfAnnotationOffset;
        yield return new("edf-tal-text-not-closed", "a.edf", Patch(edf, tal2, 64, "+1\u0014" + new string('A', 61)),
            "bad TAL in data record 2: annotation text is not closed by 0x14", tal2 + 3);
        var tal5 = HeaderBytes + 4 * EdfRecordBytes + EdfAnnotationOffset;
        yield return new("edf-plus-c-record-out-of-place", "a.edf", Patch(edf, tal5, 2, "+9"),
            "data record 5 of an EDF+C file starts at +9 s by its time-keeping TAL, but contiguous records put it at +4 s", tal5);

        yield return new("edf-bdf-wrong-identification", "a.bdf", Patch(bdf, 1, 7, "BIOSEMX"),
            "header field 'version' of a BDF file must be 0xFF followed by 'BIOSEMI' (found 0xFF 'BIOSEMX')", 0);
        yield return new("edf-bdf-wrong-format-version", "a.bdf", Patch(bdf, 192, 44, "16BIT"),
            "header field 'version of data format' (reserved) of a BDF file must begin with '24BIT', 'BDF+C' or 'BDF+D' ('16BIT')", 192);
        yield return new("edf-bdf-digital-max-out-of-range", "a.bdf", Patch(bdf, 640, 8, "9000000"),
            "signal 1 'ECG I': digital maximum 9000000 is outside the 24-bit range -8388608…8388607", 640);
        yield return new("edf-bdf-truncated-mid-record", "a.bdf", bdf[..(HeaderBytes + 8 * BdfRecordBytes + 1)],
            $"declared 10 data records of {BdfRecordBytes} bytes but the file holds 8 and ends 1 bytes into data record 9", HeaderBytes + 8 * BdfRecordBytes);
    }

    /// <summary>A good 10-record EDF+C (or BDF+C) file: 2 ECG leads at 50 Hz, one annotation in record 3.</summary>
    private static byte[] Good(bool bdf)
    {
        using var folder = new TempFolder("edf-corpus");
        var path = folder.Path(bdf ? "good.bdf" : "good.edf");
        var options = new EdfWriterOptions
        {
            Channels =
            [
                new EdfWriterChannel { Label = "ECG I", PhysicalMin = -5, PhysicalMax = 5, SamplesPerRecord = Samples },
                new EdfWriterChannel { Label = "ECG II", PhysicalMin = -5, PhysicalMax = 5, SamplesPerRecord = Samples },
            ],
            Start = new DateTime(2024, 3, 5, 21, 30, 0),
            AnnotationBytesPerRecord = 64,
            Bdf = bdf,
        };
        var x = EdfTestSignals.Make(Records * Samples, Samples, 2, seed: 11);
        EdfTestSignals.Write(path, options, [x, x], Records * Samples, w => w.AddAnnotation(2.5, null, "Patient button"));
        var bytes = File.ReadAllBytes(path);
        if (bytes.Length != HeaderBytes + Records * (bdf ? BdfRecordBytes : EdfRecordBytes))
        {
            throw new InvalidOperationException("the corpus's good file does not have the layout its offsets assume");
        }

        return bytes;
    }

    /// <summary>A copy with <paramref name="text"/> written left-justified and space-padded into a header field.</summary>
    private static byte[] Patch(byte[] bytes, int offset, int width, string text)
    {
        var copy = (byte[])bytes.Clone();
        copy.AsSpan(offset, width).Fill((byte)' ');
        Encoding.ASCII.GetBytes(text, copy.AsSpan(offset, width));
        return copy;
    }
}
