using System.Globalization;
using System.Text;

namespace LongRecord.Formats.Tests.Edf;

/// <summary>
/// Builds EDF bytes field by field from the EDF/EDF+ specifications, independently of <c>EdfWriter</c>, so the reader can be
/// tested on layouts the writer never makes (EDF+D, plain EDF, odd dates).
/// </summary>
internal static class EdfHandAssembly
{
    /// <summary>An ordinary or annotation signal: header values as text exactly as they go in the fields.</summary>
    public sealed record SignalSpec(string Label, int SamplesPerRecord, string PhysMin = "-32768", string PhysMax = "32767",
        string DigMin = "-32768", string DigMax = "32767", string Unit = "uV");

    /// <summary>One data record: samples of each ordinary signal (in order) and the TAL text of the annotation signal.</summary>
    public sealed record DataRecord(short[][] Samples, string Tals);

    public static byte[] Build(string reserved, string startDate, string startTime, string durationS, IReadOnlyList<SignalSpec> signals,
        IReadOnlyList<DataRecord> records, string? recordCount = null, string patient = "X X X X", string recording = "Startdate X X X X")
    {
        var ns = signals.Count;
        var header = new StringBuilder();
        Field(header, "0", 8);
        Field(header, patient, 80);
        Field(header, recording, 80);
        Field(header, startDate, 8);
        Field(header, startTime, 8);
        Field(header, (256 * (ns + 1)).ToString(CultureInfo.InvariantCulture), 8);
        Field(header, reserved, 44);
        Field(header, recordCount ?? records.Count.ToString(CultureInfo.InvariantCulture), 8);
        Field(header, durationS, 8);
        Field(header, ns.ToString(CultureInfo.InvariantCulture), 4);
        foreach (var s in signals) Field(header, s.Label, 16);
        foreach (var _ in signals) Field(header, "", 80);
        foreach (var s in signals) Field(header, s.Label == "EDF Annotations" ? "" : s.Unit, 8);
        foreach (var s in signals) Field(header, s.PhysMin, 8);
        foreach (var s in signals) Field(header, s.PhysMax, 8);
        foreach (var s in signals) Field(header, s.DigMin, 8);
        foreach (var s in signals) Field(header, s.DigMax, 8);
        foreach (var _ in signals) Field(header, "", 80);
        foreach (var s in signals) Field(header, s.SamplesPerRecord.ToString(CultureInfo.InvariantCulture), 8);
        foreach (var _ in signals) Field(header, "", 32);

        var bytes = new List<byte>(Encoding.Latin1.GetBytes(header.ToString()));
        foreach (var r in records)
        {
            var ordinary = 0;
            foreach (var s in signals)
            {
                if (s.Label == "EDF Annotations")
                {
                    var tal = Encoding.UTF8.GetBytes(r.Tals);
                    if (tal.Length > 2 * s.SamplesPerRecord)
                    {
                        throw new ArgumentException("TALs do not fit the annotation signal");
                    }

                    bytes.AddRange(tal);
                    bytes.AddRange(new byte[2 * s.SamplesPerRecord - tal.Length]);
                    continue;
                }

                var samples = r.Samples[ordinary++];
                if (samples.Length != s.SamplesPerRecord)
                {
                    throw new ArgumentException("sample count differs from the header");
                }

                foreach (var v in samples)
                {
                    // EDF: 2-byte two's complement, least significant byte first.
                    bytes.Add((byte)(v & 0xFF));
                    bytes.Add((byte)((v >> 8) & 0xFF));
                }
            }
        }

        return [.. bytes];
    }

    private static void Field(StringBuilder header, string text, int width)
    {
        if (text.Length > width)
        {
            throw new ArgumentException($"'{text}' is longer than {width}");
        }

        header.Append(text.PadRight(width));
    }
}
