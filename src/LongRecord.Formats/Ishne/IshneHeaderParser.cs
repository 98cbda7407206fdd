using System.Buffers.Binary;
using System.Diagnostics.CodeAnalysis;
using System.Globalization;
using System.Text;
using LongRecord.Formats.IO;

namespace LongRecord.Formats.Ishne;

/// <summary>Reads and validates the magic number, fixed block, variable block and checksum of an ISHNE 1.0 file.</summary>
internal static class IshneHeaderParser
{
    public static IshneHeader Read(ReadOnlyRecordingFile file)
    {
        var path = file.Path;
        var head = new byte[IshneLayout.VariableBlockStart];
        var got = file.ReadAtMost(0, head);
        if (got < IshneLayout.MagicLength || !head.AsSpan(0, IshneLayout.MagicLength).SequenceEqual(IshneLayout.Magic))
        {
            var shown = Printable(head.AsSpan(0, Math.Min(got, IshneLayout.MagicLength)));
            Fail(path, $"not an ISHNE Holter file: magic number '{shown}', expected 'ISHNE1.0'", 0, "magic number");
        }

        if (got < head.Length)
        {
            Fail(path, $"file ends inside the fixed-length header block (needs {head.Length} bytes, has {got})", got, "fixed-length block");
        }

        var varSize = I32(head, IshneLayout.VariableBlockSizeOffset);
        if (varSize < 0 || varSize > IshneLayout.MaxVariableBlockBytes)
        {
            Fail(path, $"size of the variable-length block {varSize} is outside 0–{IshneLayout.MaxVariableBlockBytes}",
                IshneLayout.VariableBlockSizeOffset, "size of the variable-length block");
        }

        var varOffset = I32(head, IshneLayout.VariableBlockOffsetOffset);
        if (varOffset != IshneLayout.VariableBlockStart)
        {
            Fail(path, $"offset of the variable-length block is {varOffset}, expected {IshneLayout.VariableBlockStart}",
                IshneLayout.VariableBlockOffsetOffset, "offset of the variable-length block");
        }

        var ecgOffset = I32(head, IshneLayout.EcgOffsetOffset);
        if (ecgOffset != IshneLayout.VariableBlockStart + varSize)
        {
            RecordingFormatException.Throw(path,
                $"offset of the ECG block is {ecgOffset}, expected {IshneLayout.VariableBlockStart} + variable-length block size {varSize} = {IshneLayout.VariableBlockStart + varSize}",
                IshneLayout.EcgOffsetOffset, "offset of the ECG block");
        }

        var varBlock = new byte[varSize];
        file.ReadExactly(IshneLayout.VariableBlockStart, varBlock, "the variable-length block");

        var (checksum, bigEndian) = CheckCrc(path, head, varBlock);

        var leadCount = I16(head, IshneLayout.LeadCountOffset);
        if (leadCount == 0)
        {
            RecordingFormatException.Throw(path, "no leads: number of stored leads is 0", IshneLayout.LeadCountOffset, "number of stored leads");
        }

        if (leadCount < 0 || leadCount > IshneLayout.MaxLeads)
        {
            Fail(path, $"number of stored leads {leadCount} is outside 1–{IshneLayout.MaxLeads}", IshneLayout.LeadCountOffset, "number of stored leads");
        }

        var rate = I16(head, IshneLayout.SamplingRateOffset);
        if (rate <= 0)
        {
            Fail(path, $"sampling rate {rate} Hz is not positive", IshneLayout.SamplingRateOffset, "sampling rate");
        }

        var leads = new IshneLead[leadCount];
        for (var k = 0; k < leadCount; k++)
        {
            var resolution = I16(head, IshneLayout.ResolutionOffset + 2 * k);
            if (resolution <= 0)
            {
                Fail(path, $"amplitude resolution of lead {k + 1} is {resolution} nV, must be positive",
                    IshneLayout.ResolutionOffset + 2 * k, "amplitude resolution");
            }

            leads[k] = new IshneLead(
                (IshneLeadCode)I16(head, IshneLayout.LeadSpecOffset + 2 * k),
                resolution,
                (IshneLeadQuality)I16(head, IshneLayout.LeadQualityOffset + 2 * k));
        }

        var samplesPerLead = I32(head, IshneLayout.SamplesPerLeadOffset);
        if (samplesPerLead < 0)
        {
            Fail(path, $"number of samples per lead {samplesPerLead} is negative", IshneLayout.SamplesPerLeadOffset, "number of samples per lead");
        }

        var needed = ecgOffset + (long)samplesPerLead * leadCount * sizeof(short);
        if (file.Length < needed)
        {
            RecordingFormatException.Throw(path,
                $"file ends before the {samplesPerLead} samples per lead declared at byte {IshneLayout.SamplesPerLeadOffset} (needs {needed} bytes for {leadCount} leads, has {file.Length})",
                file.Length, "number of samples per lead");
        }

        return new IshneHeader
        {
            VariableBlockSize = varSize,
            SamplesPerLead = samplesPerLead,
            VariableBlockOffset = varOffset,
            EcgOffset = ecgOffset,
            FileVersion = I16(head, IshneLayout.FileVersionOffset),
            FirstName = Text(head, IshneLayout.FirstNameOffset, IshneLayout.NameLength),
            LastName = Text(head, IshneLayout.LastNameOffset, IshneLayout.NameLength),
            SubjectId = Text(head, IshneLayout.SubjectIdOffset, IshneLayout.SubjectIdLength),
            Sex = (IshneSex)I16(head, IshneLayout.SexOffset),
            Race = I16(head, IshneLayout.RaceOffset),
            BirthDate = Date(path, head, IshneLayout.BirthDateOffset, "date of birth"),
            RecordingDate = Date(path, head, IshneLayout.RecordingDateOffset, "date of recording"),
            FileDate = FileDate(head),
            StartTime = Time(path, head),
            Leads = leads,
            Pacemaker = I16(head, IshneLayout.PacemakerOffset),
            RecorderType = Text(head, IshneLayout.RecorderOffset, IshneLayout.RecorderLength),
            SamplingRateHz = rate,
            Proprietary = Text(head, IshneLayout.ProprietaryOffset, IshneLayout.ProprietaryLength),
            Copyright = Text(head, IshneLayout.CopyrightOffset, IshneLayout.CopyrightLength),
            VariableBlockText = Text(varBlock, 0, varBlock.Length),
            Checksum = checksum,
            ChecksumBigEndian = bigEndian,
        };
    }

    private static (ushort Stored, bool BigEndian) CheckCrc(string path, byte[] head, byte[] varBlock)
    {
        var computed = IshneCrc.Update(IshneCrc.Compute(head.AsSpan(IshneLayout.ChecksumStart)), varBlock);
        var storedLittle = BinaryPrimitives.ReadUInt16LittleEndian(head.AsSpan(IshneLayout.ChecksumOffset));
        var storedBig = BinaryPrimitives.ReadUInt16BigEndian(head.AsSpan(IshneLayout.ChecksumOffset));
        if (computed == storedLittle)
        {
            return (storedLittle, false);
        }

        // Appendix B's "adding or concatenating CRCHI and CRCLO" leaves the byte order open, and writers differ.
        if (computed == storedBig)
        {
            return (storedBig, true);
        }

        Fail(path, $"header checksum mismatch: stored 0x{storedLittle:X4}, computed 0x{computed:X4}", IshneLayout.ChecksumOffset, "checksum");
        return default;
    }

    private static DateOnly? Date(string path, byte[] head, int offset, string field)
    {
        int day = I16(head, offset), month = I16(head, offset + 2), year = I16(head, offset + 4);
        if (IsUnknownDatePart(day) || IsUnknownDatePart(month) || IsUnknownDatePart(year))
        {
            return null;
        }

        if (!IsCalendarDate(day, month, year))
        {
            Fail(path, $"{field} {day}/{month}/{year} (day/month/year) is not a calendar date", offset, field);
        }

        return new DateOnly(year, month, day);
    }

    // Nothing downstream uses the file's creation date, so a damaged one is dropped rather than failing the recording.
    private static DateOnly? FileDate(byte[] head)
    {
        int day = I16(head, IshneLayout.FileDateOffset), month = I16(head, IshneLayout.FileDateOffset + 2), year = I16(head, IshneLayout.FileDateOffset + 4);
        return IsCalendarDate(day, month, year) ? new DateOnly(year, month, day) : null;
    }

    private static TimeOnly? Time(string path, byte[] head)
    {
        var offset = IshneLayout.StartTimeOffset;
        int hour = I16(head, offset), minute = I16(head, offset + 2), second = I16(head, offset + 4);
        if (hour == IshneLayout.Absent || minute == IshneLayout.Absent || second == IshneLayout.Absent)
        {
            return null;
        }

        if (hour is < 0 or > 23 || minute is < 0 or > 59 || second is < 0 or > 59)
        {
            Fail(path, $"start time {hour}:{minute}:{second} is not a clock time", offset, "start time");
        }

        return new TimeOnly(hour, minute, second);
    }

    // Numbers in messages are formatted with the invariant culture, whatever the machine's.
    [DoesNotReturn]
    private static void Fail(string path, FormattableString problem, long offset, string field) =>
        RecordingFormatException.Throw(path, problem.ToString(CultureInfo.InvariantCulture), offset, field);

    private static bool IsCalendarDate(int day, int month, int year) =>
        year is >= 1 and <= 9999 && month is >= 1 and <= 12 && day >= 1 && day <= DateTime.DaysInMonth(year, month);

    private static bool IsUnknownDatePart(int value) => value is IshneLayout.Absent or 0;

    private static short I16(byte[] b, int offset) => BinaryPrimitives.ReadInt16LittleEndian(b.AsSpan(offset));

    private static int I32(byte[] b, int offset) => BinaryPrimitives.ReadInt32LittleEndian(b.AsSpan(offset));

    // The standard names no character set; Latin-1 maps every byte to a character, so no name is ever lost or rejected.
    private static string Text(byte[] b, int offset, int length)
    {
        var span = b.AsSpan(offset, length);
        var nul = span.IndexOf((byte)0);
        if (nul >= 0)
        {
            span = span[..nul];
        }

        return Encoding.Latin1.GetString(span).Trim();
    }

    private static string Printable(ReadOnlySpan<byte> bytes)
    {
        var chars = new char[bytes.Length];
        for (var i = 0; i < bytes.Length; i++)
        {
            chars[i] = bytes[i] is >= 0x20 and < 0x7F ? (char)bytes[i] : '?';
        }

        return new string(chars);
    }
}
