using LongRecord.Formats.Csv;
using LongRecord.Formats.Edf;
using LongRecord.Formats.IO;
using LongRecord.Formats.Ishne;
using LongRecord.Formats.Wfdb;

namespace LongRecord.Formats;

/// <summary>
/// Opens any supported recording. The format is decided from the content first (magic bytes, header shape), the file
/// name's extension second; a WFDB record may be named by its header, its record path without extension, or a signal file.
/// </summary>
public static class RecordingOpener
{
    private const int SniffBytes = 4096;

    /// <summary>The format of <paramref name="path"/>, or null when it is none LongRecord reads.</summary>
    public static RecordingFormat? Detect(string path)
    {
        var target = ResolveWfdbRecord(path) ?? path;
        if (!File.Exists(target))
        {
            return null;
        }

        Span<byte> head = stackalloc byte[SniffBytes];
        int n;
        using (var file = ReadOnlyRecordingFile.Open(target))
        {
            n = file.ReadAtMost(0, head);
        }

        head = head[..n];
        if (IshneReader.Sniff(head))
        {
            return RecordingFormat.Ishne;
        }

        if (EdfReader.Sniff(head))
        {
            return head.Length > 0 && head[0] == 0xFF ? RecordingFormat.Bdf : RecordingFormat.Edf;
        }

        if (WfdbRecordReader.SniffHeader(head, target))
        {
            return RecordingFormat.Wfdb;
        }

        if (CsvRecordingReader.Sniff(head, target))
        {
            return RecordingFormat.Csv;
        }

        return null;
    }

    /// <summary>Opens <paramref name="path"/> with the reader of its format, or throws <see cref="RecordingFormatException"/>.</summary>
    public static IRecordingReader Open(string path)
    {
        var target = ResolveWfdbRecord(path) ?? path;
        if (!File.Exists(target))
        {
            throw new RecordingFormatException(path, Directory.Exists(path) ? "is a folder, not a recording" : "file not found");
        }

        // Content decides; when it says nothing, the extension names the reader whose own message says what is wrong.
        var format = Detect(target) ?? FromExtension(target);
        return format switch
        {
            RecordingFormat.Ishne => IshneReader.Open(target),
            RecordingFormat.Edf or RecordingFormat.Bdf => EdfReader.Open(target),
            RecordingFormat.Wfdb => WfdbRecordReader.Open(target),
            RecordingFormat.Csv => CsvRecordingReader.Open(target),
            _ when new FileInfo(target).Length == 0 => throw new RecordingFormatException(path, "file is empty", 0),
            _ => throw new RecordingFormatException(path, "not a recording LongRecord reads (EDF, EDF+, BDF, WFDB header, ISHNE 1.0, CSV)", 0),
        };
    }

    private static RecordingFormat? FromExtension(string path) => Path.GetExtension(path).ToLowerInvariant() switch
    {
        ".edf" or ".rec" => RecordingFormat.Edf,
        ".bdf" => RecordingFormat.Bdf,
        ".hea" => RecordingFormat.Wfdb,
        ".ecg" or ".ishne" => RecordingFormat.Ishne,
        ".csv" or ".txt" => RecordingFormat.Csv,
        _ => null,
    };

    // A WFDB record is opened through its header: "100" or "100.dat" beside "100.hea" means "100.hea".
    private static string? ResolveWfdbRecord(string path)
    {
        if (path.EndsWith(".hea", StringComparison.OrdinalIgnoreCase))
        {
            return null;
        }

        if (!File.Exists(path) && File.Exists(path + ".hea"))
        {
            return path + ".hea";
        }

        if (path.EndsWith(".dat", StringComparison.OrdinalIgnoreCase))
        {
            var hea = Path.ChangeExtension(path, ".hea");
            return File.Exists(hea) ? hea : null;
        }

        return null;
    }
}
