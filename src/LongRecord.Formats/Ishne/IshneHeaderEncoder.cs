using System.Buffers.Binary;
using System.Text;

namespace LongRecord.Formats.Ishne;

/// <summary>Lays out the ISHNE 1.0 header (Table 3) for <see cref="IshneWriter"/> and seals it with the checksum.</summary>
internal static class IshneHeaderEncoder
{
    /// <summary>Checks <paramref name="options"/> and returns the header bytes with samples per lead 0 and no checksum yet.</summary>
    public static byte[] Encode(IshneWriterOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var leads = options.Leads ?? throw new ArgumentException("leads are required", nameof(options));
        if (leads.Count is < 1 or > IshneLayout.MaxLeads)
        {
            throw new ArgumentOutOfRangeException(nameof(options), leads.Count, "an ISHNE file stores 1 to 12 leads");
        }

        if (options.SamplingRateHz <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(options), options.SamplingRateHz, "sampling rate must be positive");
        }

        var text = Latin1(options.VariableBlockText, nameof(options.VariableBlockText));
        if (text.Length > IshneLayout.MaxVariableBlockBytes)
        {
            throw new ArgumentException("variable-block text is too long", nameof(options));
        }

        var header = new byte[IshneLayout.VariableBlockStart + text.Length];
        var h = header.AsSpan();
        IshneLayout.Magic.CopyTo(h);
        PutInt(h, IshneLayout.VariableBlockSizeOffset, text.Length);
        PutInt(h, IshneLayout.SamplesPerLeadOffset, 0);
        PutInt(h, IshneLayout.VariableBlockOffsetOffset, IshneLayout.VariableBlockStart);
        PutInt(h, IshneLayout.EcgOffsetOffset, header.Length);
        PutShort(h, IshneLayout.FileVersionOffset, options.FileVersion);
        PutText(h, IshneLayout.FirstNameOffset, IshneLayout.NameLength, options.FirstName, nameof(options.FirstName));
        PutText(h, IshneLayout.LastNameOffset, IshneLayout.NameLength, options.LastName, nameof(options.LastName));
        PutText(h, IshneLayout.SubjectIdOffset, IshneLayout.SubjectIdLength, options.SubjectId, nameof(options.SubjectId));
        PutShort(h, IshneLayout.SexOffset, (short)options.Sex);
        PutShort(h, IshneLayout.RaceOffset, options.Race);
        PutDate(h, IshneLayout.BirthDateOffset, options.BirthDate);
        PutDate(h, IshneLayout.RecordingDateOffset, options.RecordingDate);
        PutDate(h, IshneLayout.FileDateOffset, options.FileDate ?? DateOnly.FromDateTime(DateTime.Now));
        PutTime(h, IshneLayout.StartTimeOffset, options.StartTime);
        PutShort(h, IshneLayout.LeadCountOffset, (short)leads.Count);
        for (var k = 0; k < IshneLayout.MaxLeads; k++)
        {
            var lead = k < leads.Count ? leads[k] : null;
            if (lead is not null && lead.ResolutionNv <= 0)
            {
                throw new ArgumentOutOfRangeException(nameof(options), lead.ResolutionNv, $"resolution of lead {k + 1} must be positive");
            }

            PutShort(h, IshneLayout.LeadSpecOffset + 2 * k, lead is null ? IshneLayout.Absent : (short)lead.Code);
            PutShort(h, IshneLayout.LeadQualityOffset + 2 * k, lead is null ? IshneLayout.Absent : (short)lead.Quality);
            PutShort(h, IshneLayout.ResolutionOffset + 2 * k, lead is null ? IshneLayout.Absent : lead.ResolutionNv);
        }

        PutShort(h, IshneLayout.PacemakerOffset, options.Pacemaker);
        PutText(h, IshneLayout.RecorderOffset, IshneLayout.RecorderLength, options.RecorderType, nameof(options.RecorderType));
        PutShort(h, IshneLayout.SamplingRateOffset, options.SamplingRateHz);
        PutText(h, IshneLayout.ProprietaryOffset, IshneLayout.ProprietaryLength, options.Proprietary, nameof(options.Proprietary));
        PutText(h, IshneLayout.CopyrightOffset, IshneLayout.CopyrightLength, options.Copyright, nameof(options.Copyright));
        text.CopyTo(h[IshneLayout.VariableBlockStart..]);
        return header;
    }

    /// <summary>Writes the final samples-per-lead count and the checksum (little-endian) into <paramref name="header"/>.</summary>
    public static void Seal(Span<byte> header, int samplesPerLead)
    {
        PutInt(header, IshneLayout.SamplesPerLeadOffset, samplesPerLead);
        var crc = IshneCrc.Compute(header[IshneLayout.ChecksumStart..]);
        BinaryPrimitives.WriteUInt16LittleEndian(header[IshneLayout.ChecksumOffset..], crc);
    }

    private static void PutInt(Span<byte> h, int offset, int value) => BinaryPrimitives.WriteInt32LittleEndian(h[offset..], value);

    private static void PutShort(Span<byte> h, int offset, short value) => BinaryPrimitives.WriteInt16LittleEndian(h[offset..], value);

    private static void PutDate(Span<byte> h, int offset, DateOnly? date)
    {
        PutShort(h, offset, date is DateOnly d ? (short)d.Day : IshneLayout.Absent);
        PutShort(h, offset + 2, date is DateOnly m ? (short)m.Month : IshneLayout.Absent);
        PutShort(h, offset + 4, date is DateOnly y ? (short)y.Year : IshneLayout.Absent);
    }

    // Seconds only: the header has no field for fractions.
    private static void PutTime(Span<byte> h, int offset, TimeOnly? time)
    {
        PutShort(h, offset, time is TimeOnly t ? (short)t.Hour : IshneLayout.Absent);
        PutShort(h, offset + 2, time is TimeOnly m ? (short)m.Minute : IshneLayout.Absent);
        PutShort(h, offset + 4, time is TimeOnly s ? (short)s.Second : IshneLayout.Absent);
    }

    private static void PutText(Span<byte> h, int offset, int length, string value, string name)
    {
        var bytes = Latin1(value, name);
        if (bytes.Length > length)
        {
            throw new ArgumentException($"{name} has {bytes.Length} characters; the field holds {length}", name);
        }

        bytes.CopyTo(h[offset..]);
    }

    private static byte[] Latin1(string? value, string name)
    {
        value ??= "";
        foreach (var c in value)
        {
            if (c > '\u00FF' || c == '\0')
            {
                throw new ArgumentException($"{name} holds a character that Latin-1 cannot store: U+{(int)c:X4}", name);
            }
        }

        return Encoding.Latin1.GetBytes(value);
    }
}
