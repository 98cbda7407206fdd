using LongRecord.Formats;
using LongRecord.Pipeline.Inputs;

namespace LongRecord.Pipeline.Batch;

/// <summary>
/// The one-line reason of a failed recording, for logs and the index: <c>&lt;file&gt;: &lt;problem&gt; at byte &lt;n&gt;</c>
/// with the file named relative to the input root, so folder names above it (often patients' names) never appear.
/// </summary>
public static class FailureText
{
    public static string Of(RecordingFormatException e, RecordingInput input)
    {
        var file = RelativeName(e.FilePath, input);
        return e.ByteOffset is long b ? $"{file}: {e.Problem} at byte {b}" : $"{file}: {e.Problem}";
    }

    /// <summary>A file that could not be read at all (permissions, I/O error): the system's message, root removed.</summary>
    public static string OfIo(Exception e, RecordingInput input)
    {
        var message = e is UnauthorizedAccessException ? "permission denied" : e.Message;
        var root = RootOf(input);
        if (root is not null)
        {
            message = message.Replace(root + Path.DirectorySeparatorChar, "", StringComparison.Ordinal);
        }
        else
        {
            // A pseudonymised input: its real path and folder may name the patient.
            var full = Path.GetFullPath(input.Path);
            message = message.Replace(full, BatchNames.Display(input), StringComparison.Ordinal)
                .Replace(Path.GetDirectoryName(full) + Path.DirectorySeparatorChar, "", StringComparison.Ordinal);
        }

        return $"{BatchNames.Display(input)}: cannot be read ({message.Replace('\r', ' ').Replace('\n', ' ')})";
    }

    /// <summary>A fault of LongRecord itself while analysing this recording.</summary>
    public static string OfFault(Exception e, RecordingInput input) =>
        $"{BatchNames.Display(input)}: internal error (please report): {e.GetType().Name}: {e.Message.Replace('\r', ' ').Replace('\n', ' ')}";

    private static string RelativeName(string filePath, RecordingInput input)
    {
        var full = Path.GetFullPath(filePath);
        if (full == Path.GetFullPath(input.Path))
        {
            return BatchNames.Display(input);
        }

        var root = RootOf(input);
        if (root is null)
        {
            // A pseudonymised input: name any of its files by the pseudonym alone.
            return BatchNames.Display(input);
        }

        return full.StartsWith(root + Path.DirectorySeparatorChar, StringComparison.Ordinal)
            ? Path.GetRelativePath(root, full).Replace('\\', '/')
            : Path.GetFileName(full);
    }

    // The input root: the recording's full path less its relative path; null when the relative path is not the end
    // of the real one (a pseudonym under --deidentify).
    private static string? RootOf(RecordingInput input)
    {
        var full = Path.GetFullPath(input.Path);
        var relative = input.RelativePath.Replace('/', Path.DirectorySeparatorChar);
        if (full == relative || Path.GetFileName(full) == relative)
        {
            return Path.GetDirectoryName(full);
        }

        return full.EndsWith(Path.DirectorySeparatorChar + relative, StringComparison.Ordinal)
            ? full[..^(relative.Length + 1)]
            : null;
    }
}
