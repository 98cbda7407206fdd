using LongRecord.Formats.IO;

namespace LongRecord.Formats.Edf;

/// <summary>
/// Parses and checks the header record of an EDF (Kemp et al. 1992), EDF+ (Kemp and Olivan 2003) or BDF file.
/// Every field is checked; the first bad one is reported with its byte offset.
/// </summary>
internal static class EdfHeaderParser
{
    public const int FixedBytes = 256;
    public const int BytesPerSignalHeader = 256;

    // Data records larger than this are refused: nothing real comes close (the EDF spec recommends at most
    // 61,440 bytes) and it bounds the reader's buffer (common practice, no source).
    private const int MaxRecordBytes = 64 << 20;

    // Per-signal field widths in header order (EDF spec, "header record").
    private static readonly (string Name, int Width)[] s_signalFields =
    [
        ("label", 16), ("transducer type", 80), ("physical dimension", 8), ("physical minimum", 8),
        ("physical maximum", 8), ("digital minimum", 8), ("digital maximum", 8), ("prefiltering", 80),
        ("nr of samples in each data record", 8), ("reserved", 32),
    ];

    public static EdfHeader Parse(ReadOnlyRecordingFile file)
    {
        var path = file.Path;
        if (file.Length < FixedBytes)
        {
            RecordingFormatException.Throw(path,
                $"file is shorter than its header declares (the fixed header alone is {FixedBytes} bytes, the file has {file.Length})",
                file.Length, "header");
        }

        var fixedBytes = new byte[FixedBytes];
        file.ReadExactly(0, fixedBytes, "the fixed header");
        var f = new EdfHeaderFields(path, fixedBytes);

        var isBdf = ParseVersion(fixedBytes, f);
        var patient = f.Text(8, 80);
        var recording = f.Text(88, 80);
        var reserved = f.Text(192, 44);
        var variant = ParseVariant(reserved, isBdf, f);

        var dateText = f.Text(168, 8);
        if (!EdfDates.TryParseTriple(dateText, allowYy: variant != EdfVariant.Plain, out var day, out var month, out var yy))
        {
            f.Fail($"header field 'startdate' is not a date dd.mm.yy ('{dateText}')", 168, "startdate");
        }

        var timeText = f.Text(176, 8);
        if (!EdfDates.TryParseTriple(timeText, allowYy: false, out var hour, out var minute, out var second)
            || hour > 23 || minute > 59 || second > 59)
        {
            f.Fail($"header field 'starttime' is not a time hh.mm.ss ('{timeText}')", 176, "starttime");
        }

        var startDate = ResolveDate(day, month, yy, variant, recording, f);
        var headerBytes = f.Integer(184, 8, "header field 'number of bytes in header record'", "number of bytes in header record");
        var records = f.Integer(236, 8, "header field 'number of data records'", "number of data records");
        if (records < -1)
        {
            f.Fail($"header field 'number of data records' is negative ({records}); only -1 (unknown) is allowed", 236, "number of data records");
        }

        var durationS = f.Real(244, 8, "header field 'duration of a data record'", "duration of a data record");
        if (durationS < 0)
        {
            f.Fail($"header field 'duration of a data record' is negative ({durationS.ToInvariant()} s)", 244, "duration of a data record");
        }

        var ns = f.Integer(252, 4, "header field 'number of signals'", "number of signals");
        if (ns <= 0)
        {
            f.Fail($"header field 'number of signals' is {ns}: the file holds no signal", 252, "number of signals");
        }

        var expectedHeader = FixedBytes + ns * BytesPerSignalHeader;
        if (headerBytes != expectedHeader)
        {
            f.Fail($"header field 'number of bytes in header record' is {headerBytes} but {ns} signals need 256 × ({ns} + 1) = {expectedHeader}",
                184, "number of bytes in header record");
        }

        if (file.Length < expectedHeader)
        {
            RecordingFormatException.Throw(path,
                $"file is shorter than its header declares ({ns} signals need {expectedHeader} header bytes, the file has {file.Length})",
                file.Length, "header");
        }

        var all = new byte[expectedHeader];
        fixedBytes.CopyTo(all, 0);
        file.ReadExactly(FixedBytes, all.AsSpan(FixedBytes), "the signal headers");
        var signals = ParseSignals(new EdfHeaderFields(path, all), ns, isBdf, out var recordBytes);

        if (durationS == 0 && signals.FirstOrDefault(s => !s.IsAnnotation) is { } ordinary)
        {
            f.Fail($"header field 'duration of a data record' is 0, which only an annotation-only file may have, but signal {ordinary.Index + 1} '{ordinary.Label}' holds samples",
                244, "duration of a data record");
        }

        if (variant == EdfVariant.Discontinuous && !signals.Any(s => s.IsAnnotation))
        {
            f.Fail($"an {(isBdf ? "BDF" : "EDF")}+D file needs an annotation signal to time its data records, but none of its {ns} signals is one",
                192, "reserved");
        }

        return new EdfHeader
        {
            IsBdf = isBdf,
            Variant = variant,
            PatientField = patient,
            RecordingField = recording,
            StartDate = startDate,
            StartTime = new TimeOnly(hour, minute, second),
            HeaderBytes = headerBytes,
            DeclaredRecords = records,
            RecordDurationS = durationS,
            Signals = signals,
            RecordBytes = recordBytes,
        };
    }

    /// <summary>Returns true for BDF (0xFF "BIOSEMI"), false for EDF ("0" and spaces).</summary>
    private static bool ParseVersion(byte[] head, EdfHeaderFields f)
    {
        if (head[0] == 0xFF)
        {
            var id = f.Text(1, 7);
            if (id != "BIOSEMI")
            {
                f.Fail($"header field 'version' of a BDF file must be 0xFF followed by 'BIOSEMI' (found 0xFF '{id}')", 0, "version");
            }

            return true;
        }

        var version = f.Text(0, 8);
        if (version != "0")
        {
            f.Fail($"header field 'version' is neither EDF '0' nor BDF 0xFF 'BIOSEMI' ('{version}')", 0, "version");
        }

        return false;
    }

    /// <summary>
    /// EDF+ writes "EDF+C" or "EDF+D" at the start of the reserved field. BioSemi writes "24BIT" there for BDF and
    /// BDF+ writes "BDF+C"/"BDF+D" (edfplus.info BDF+ page, from memory); a BDF file with anything else is refused.
    /// </summary>
    private static EdfVariant ParseVariant(string reserved, bool isBdf, EdfHeaderFields f)
    {
        if (reserved.StartsWith("EDF+C", StringComparison.Ordinal) || (isBdf && reserved.StartsWith("BDF+C", StringComparison.Ordinal)))
        {
            return EdfVariant.Continuous;
        }

        if (reserved.StartsWith("EDF+D", StringComparison.Ordinal) || (isBdf && reserved.StartsWith("BDF+D", StringComparison.Ordinal)))
        {
            return EdfVariant.Discontinuous;
        }

        if (isBdf && !reserved.StartsWith("24BIT", StringComparison.Ordinal))
        {
            f.Fail($"header field 'version of data format' (reserved) of a BDF file must begin with '24BIT', 'BDF+C' or 'BDF+D' ('{reserved}')",
                192, "reserved");
        }

        return EdfVariant.Plain;
    }

    private static DateOnly? ResolveDate(int day, int month, int yy, EdfVariant variant, string recording, EdfHeaderFields f)
    {
        DateOnly? header = null;
        if (yy >= 0)
        {
            var year = EdfDates.ExpandYear(yy);
            if (month < 1 || month > 12 || day < 1 || day > DateTime.DaysInMonth(year, month))
            {
                f.Fail($"header field 'startdate' is not a valid date ('{f.Text(168, 8)}')", 168, "startdate");
            }

            header = new DateOnly(year, month, day);
        }

        // EDF+ 2.1.3.2: the recording field starts "Startdate dd-MMM-yyyy"; its 4-digit year is the one to trust.
        if (variant != EdfVariant.Plain && EdfIdentificationParser.TryStartDate(recording, out var plusDate))
        {
            return plusDate;
        }

        if (header is null)
        {
            f.Fail("header field 'startdate' has year 'yy' but the recording field holds no 'Startdate dd-MMM-yyyy'", 168, "startdate");
        }

        return header;
    }

    private static List<EdfSignalHeader> ParseSignals(EdfHeaderFields f, int ns, bool isBdf, out int recordBytes)
    {
        var fieldStart = new int[s_signalFields.Length];
        var at = FixedBytes;
        for (var k = 0; k < s_signalFields.Length; k++)
        {
            fieldStart[k] = at;
            at += ns * s_signalFields[k].Width;
        }

        int Offset(int field, int signal) => fieldStart[field] + signal * s_signalFields[field].Width;
        string Text(int field, int signal) => f.Text(Offset(field, signal), s_signalFields[field].Width);

        var (digitalLow, digitalHigh, bits) = isBdf ? (-8388608, 8388607, 24) : (-32768, 32767, 16);
        var bytesPerSample = isBdf ? 3 : 2;
        var signals = new List<EdfSignalHeader>(ns);
        long offsetInRecord = 0;
        for (var i = 0; i < ns; i++)
        {
            var label = Text(0, i).Trim();
            var who = $"signal {i + 1} '{label}'";
            double Real(int field) => f.Real(Offset(field, i), 8, $"{who}: field '{s_signalFields[field].Name}'", s_signalFields[field].Name);
            int Integer(int field) => f.Integer(Offset(field, i), 8, $"{who}: field '{s_signalFields[field].Name}'", s_signalFields[field].Name);

            var physMin = Real(3);
            var physMax = Real(4);
            var digMin = Integer(5);
            var digMax = Integer(6);
            var samples = Integer(8);

            if (physMin == physMax)
            {
                f.Fail($"{who}: physical minimum equals physical maximum ({physMin.ToInvariant()})", Offset(3, i), "physical minimum");
            }

            foreach (var (value, field) in new[] { (digMin, 5), (digMax, 6) })
            {
                if (value < digitalLow || value > digitalHigh)
                {
                    f.Fail($"{who}: {s_signalFields[field].Name} {value} is outside the {bits}-bit range {digitalLow}…{digitalHigh}",
                        Offset(field, i), s_signalFields[field].Name);
                }
            }

            if (digMin == digMax)
            {
                f.Fail($"{who}: digital minimum equals digital maximum ({digMin})", Offset(5, i), "digital minimum");
            }

            if (digMin > digMax)
            {
                f.Fail($"{who}: digital minimum ({digMin}) is greater than digital maximum ({digMax})", Offset(5, i), "digital minimum");
            }

            if (samples <= 0)
            {
                f.Fail($"{who}: field 'nr of samples in each data record' must be positive ({samples})", Offset(8, i), s_signalFields[8].Name);
            }

            signals.Add(new EdfSignalHeader
            {
                Index = i,
                Label = label,
                Transducer = Text(1, i).Trim(),
                PhysicalUnit = Text(2, i).Trim(),
                PhysicalMin = physMin,
                PhysicalMax = physMax,
                DigitalMin = digMin,
                DigitalMax = digMax,
                Prefilter = Text(7, i).Trim(),
                SamplesPerRecord = samples,
                OffsetInRecord = (int)Math.Min(offsetInRecord, int.MaxValue),
                IsAnnotation = label is "EDF Annotations" or "BDF Annotations",
            });

            offsetInRecord += (long)samples * bytesPerSample;
            if (offsetInRecord > MaxRecordBytes)
            {
                f.Fail($"{who}: data records would exceed {MaxRecordBytes} bytes ({samples} samples per record)", Offset(8, i), s_signalFields[8].Name);
            }
        }

        recordBytes = (int)offsetInRecord;
        return signals;
    }
}
