using System.Globalization;
using System.Text;

namespace LongRecord.Formats.Edf;

/// <summary>One signal as <see cref="EdfWriter"/> lays it out: header texts, quantisation and place in the record.</summary>
internal sealed record EdfWriterSignal
{
    public required string[] Fields { get; init; }
    public required int SamplesPerRecord { get; init; }
    public required int OffsetInRecord { get; init; }
    public required int DigitalMin { get; init; }
    public required int DigitalMax { get; init; }

    /// <summary>Digital units per input unit (per mV for voltage channels): digital = round(Gain × input + Baseline).</summary>
    public required double Gain { get; init; }

    public required double Baseline { get; init; }
}

/// <summary>
/// Checks <see cref="EdfWriterOptions"/> (reporting every problem at once) and fixes the header record and data-record
/// layout of an EDF+C / BDF+C file. Numbers are quantised with the values as written in the header, so a reader
/// recomputes exactly the gains the writer used.
/// </summary>
internal sealed class EdfWriterLayout
{
    // Widths of the per-signal fields, in header order (EDF spec).
    private static readonly int[] s_widths = [16, 80, 8, 8, 8, 8, 8, 80, 8, 32];

    public required bool Bdf { get; init; }
    public required double RecordDurationS { get; init; }
    public required double StartFractionS { get; init; }
    public required IReadOnlyList<EdfWriterSignal> Channels { get; init; }
    public required EdfWriterSignal Annotation { get; init; }
    public required int RecordBytes { get; init; }
    public required byte[] Header { get; init; }

    public int BytesPerSample => Bdf ? 3 : 2;

    public int AnnotationBytes => Annotation.SamplesPerRecord * BytesPerSample;

    public static EdfWriterLayout Create(EdfWriterOptions o)
    {
        var problems = new List<string>();
        var bps = o.Bdf ? 3 : 2;
        var (low, high) = o.Bdf ? (-8388608, 8388607) : (-32768, 32767);

        var durationText = o.RecordDurationS > 0 ? EdfNumberText.Fit(o.RecordDurationS, 8) : null;
        var duration = durationText is null ? 0 : double.Parse(durationText, CultureInfo.InvariantCulture);
        if (duration <= 0)
        {
            problems.Add($"record duration must be positive and fit in 8 characters ({o.RecordDurationS.ToInvariant()} s)");
        }

        var channels = new List<EdfWriterSignal>();
        var offset = 0L;
        for (var i = 0; i < o.Channels.Count; i++)
        {
            var c = o.Channels[i];
            var who = $"channel {i + 1} '{c.Label}'";
            CheckText(problems, $"{who} label", c.Label, 16);
            CheckText(problems, $"{who} transducer", c.Transducer, 80);
            CheckText(problems, $"{who} physical unit", c.PhysicalUnit, 8);
            CheckText(problems, $"{who} prefilter", c.Prefilter, 80);
            if (c.Label.Trim() is "EDF Annotations" or "BDF Annotations")
            {
                problems.Add($"{who}: that label is reserved for the annotation signal");
            }

            var minText = EdfNumberText.Fit(c.PhysicalMin, 8);
            var maxText = EdfNumberText.Fit(c.PhysicalMax, 8);
            var physMin = minText is null ? double.NaN : double.Parse(minText, CultureInfo.InvariantCulture);
            var physMax = maxText is null ? double.NaN : double.Parse(maxText, CultureInfo.InvariantCulture);
            if (minText is null || maxText is null)
            {
                problems.Add($"{who}: physical minimum and maximum must be finite and fit in 8 characters ({c.PhysicalMin.ToInvariant()}, {c.PhysicalMax.ToInvariant()})");
            }
            else if (physMin == physMax)
            {
                problems.Add($"{who}: physical minimum equals physical maximum as written ({minText})");
            }

            var digMin = c.DigitalMin ?? low;
            var digMax = c.DigitalMax ?? high;
            if (digMin < low || digMax > high || digMin >= digMax)
            {
                problems.Add($"{who}: digital range {digMin}…{digMax} must be increasing and within {low}…{high}");
            }

            if (c.SamplesPerRecord <= 0)
            {
                problems.Add($"{who}: samples per record must be positive ({c.SamplesPerRecord})");
            }

            // Gain per physical unit, then per millivolt for voltage units (samples arrive in mV).
            var gain = ((double)digMax - digMin) / (physMax - physMin);
            var mvPerUnit = VoltageUnits.MillivoltsPer(c.PhysicalUnit);
            var inputGain = double.IsNaN(mvPerUnit) ? gain : gain / mvPerUnit;
            channels.Add(new EdfWriterSignal
            {
                Fields = [c.Label, c.Transducer, c.PhysicalUnit, minText ?? "", maxText ?? "", Int(digMin), Int(digMax), c.Prefilter, Int(c.SamplesPerRecord), ""],
                SamplesPerRecord = c.SamplesPerRecord,
                OffsetInRecord = (int)Math.Min(offset, int.MaxValue),
                DigitalMin = digMin,
                DigitalMax = digMax,
                Gain = inputGain,
                Baseline = digMin - physMin * gain,
            });
            offset += (long)Math.Max(c.SamplesPerRecord, 0) * bps;
        }

        var annotationSamples = (Math.Max(o.AnnotationBytesPerRecord, 0) + bps - 1) / bps;
        if (annotationSamples * bps < MinAnnotationBytes)
        {
            problems.Add($"annotation bytes per record must be at least {MinAnnotationBytes} ({o.AnnotationBytesPerRecord})");
        }

        // EDF+ 2.2.1: the annotation signal has digital range −32768…32767 (BDF+: the 24-bit range) and physical −1…1.
        var annotation = new EdfWriterSignal
        {
            Fields = [o.Bdf ? "BDF Annotations" : "EDF Annotations", "", "", "-1", "1", Int(low), Int(high), "", Int(annotationSamples), ""],
            SamplesPerRecord = annotationSamples,
            OffsetInRecord = (int)Math.Min(offset, int.MaxValue),
            DigitalMin = low,
            DigitalMax = high,
            Gain = 1,
            Baseline = 0,
        };
        offset += (long)annotationSamples * bps;
        if (offset > 64 << 20)
        {
            problems.Add($"a data record would be {offset} bytes; keep it under 64 MiB");
        }

        var start = o.Start;
        if (start.Year < 1985)
        {
            problems.Add($"start {start:yyyy-MM-dd} is before 1985, which EDF dates cannot express");
        }

        var patient = string.Join(' ', Sub(o.PatientCode), Sub(o.PatientSex), o.PatientBirthDate is DateOnly b ? EdfDates.FormatPlusDate(b) : "X", Sub(o.PatientName));
        var recording = string.Join(' ', "Startdate", EdfDates.FormatPlusDate(DateOnly.FromDateTime(start)), Sub(o.AdminCode), Sub(o.Technician), Sub(o.Equipment));
        CheckText(problems, "patient identification", patient, 80);
        CheckText(problems, "recording identification", recording, 80);
        if (o.PatientSex is not (null or "F" or "M"))
        {
            problems.Add($"patient sex must be \"F\", \"M\" or null ('{o.PatientSex}')");
        }

        if (problems.Count > 0)
        {
            throw new ArgumentException("invalid EDF writer options: " + string.Join("; ", problems), nameof(o));
        }

        var all = channels.Append(annotation).ToArray();
        var header = BuildHeader(o.Bdf, patient, recording, start, duration, all);
        return new EdfWriterLayout
        {
            Bdf = o.Bdf,
            RecordDurationS = duration,
            StartFractionS = (start.Ticks % TimeSpan.TicksPerSecond) / (double)TimeSpan.TicksPerSecond,
            Channels = channels,
            Annotation = annotation,
            RecordBytes = (int)offset,
            Header = header,
        };
    }

    /// <summary>Room for the longest time-keeping TAL ("+" 9 digits "." 7 digits 0x14 0x14 0x00) and a short annotation.</summary>
    public const int MinAnnotationBytes = 32;

    /// <summary>Upper bound on a time-keeping TAL, reserved in every record before annotations are placed.</summary>
    public const int MaxTimeKeepingBytes = 21;

    /// <summary>Writes the record count (−1 while writing) into the header's 'number of data records' field.</summary>
    public static void SetRecordCount(Span<byte> header, int records) => Put(header, 236, 8, Int(records));

    private static byte[] BuildHeader(bool bdf, string patient, string recording, DateTime start, double duration, EdfWriterSignal[] signals)
    {
        var ns = signals.Length;
        var header = new byte[256 * (ns + 1)];
        header.AsSpan().Fill((byte)' ');
        if (bdf)
        {
            header[0] = 0xFF;
            Put(header, 1, 7, "BIOSEMI");
        }
        else
        {
            Put(header, 0, 8, "0");
        }

        Put(header, 8, 80, patient);
        Put(header, 88, 80, recording);
        // EDF+ 2.1.3.2: after 2084 the header year is the literal "yy" and the recording field holds the date.
        var yy = start.Year > 2084 ? "yy" : (start.Year % 100).ToString("00", CultureInfo.InvariantCulture);
        Put(header, 168, 8, string.Create(CultureInfo.InvariantCulture, $"{start.Day:00}.{start.Month:00}.{yy}"));
        Put(header, 176, 8, string.Create(CultureInfo.InvariantCulture, $"{start.Hour:00}.{start.Minute:00}.{start.Second:00}"));
        Put(header, 184, 8, Int(header.Length));
        Put(header, 192, 44, bdf ? "BDF+C" : "EDF+C");
        SetRecordCount(header, -1);
        Put(header, 244, 8, EdfNumberText.Fit(duration, 8)!);
        Put(header, 252, 4, Int(ns));

        var at = 256;
        for (var field = 0; field < s_widths.Length; field++)
        {
            for (var i = 0; i < ns; i++)
            {
                Put(header, at, s_widths[field], signals[i].Fields[field]);
                at += s_widths[field];
            }
        }

        return header;
    }

    private static void Put(Span<byte> header, int offset, int width, string text)
    {
        var field = header.Slice(offset, width);
        field.Fill((byte)' ');
        Encoding.ASCII.GetBytes(text, field);
    }

    private static string Int(int value) => value.ToString(CultureInfo.InvariantCulture);

    /// <summary>An EDF+ subfield: "X" when unknown, spaces replaced by '_'.</summary>
    private static string Sub(string? value) => string.IsNullOrWhiteSpace(value) ? "X" : value.Trim().Replace(' ', '_');

    private static void CheckText(List<string> problems, string what, string text, int width)
    {
        if (text.Length > width)
        {
            problems.Add($"{what} is longer than {width} characters ('{text}')");
        }

        if (text.Any(ch => ch < ' ' || ch > '~'))
        {
            problems.Add($"{what} must be printable ASCII ('{text}')");
        }
    }
}
