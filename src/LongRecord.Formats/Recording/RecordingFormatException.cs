using System.Diagnostics.CodeAnalysis;

namespace LongRecord.Formats;

/// <summary>
/// The one error type every reader raises for a file it cannot read. Its message is a single line,
/// <c>&lt;file&gt;: &lt;problem&gt; at byte &lt;n&gt;</c>, fit to print as it is.
/// </summary>
public sealed class RecordingFormatException : Exception
{
    public RecordingFormatException(string filePath, string problem, long? byteOffset = null, string? field = null, Exception? inner = null)
        : base(Compose(filePath, problem, byteOffset), inner)
    {
        FilePath = filePath;
        Problem = OneLine(problem);
        ByteOffset = byteOffset;
        Field = field;
    }

    /// <summary>The file as the caller named it.</summary>
    public string FilePath { get; }

    /// <summary>What is wrong, without the file name or position.</summary>
    public string Problem { get; }

    /// <summary>Byte offset in <see cref="FilePath"/> where the problem was found, when it has one.</summary>
    public long? ByteOffset { get; }

    /// <summary>The header field concerned, when there is one (for example <c>number of signals</c>).</summary>
    public string? Field { get; }

    [DoesNotReturn]
    public static void Throw(string filePath, string problem, long? byteOffset = null, string? field = null) =>
        throw new RecordingFormatException(filePath, problem, byteOffset, field);

    private static string Compose(string filePath, string problem, long? byteOffset) =>
        byteOffset is long offset
            ? $"{filePath}: {OneLine(problem)} at byte {offset}"
            : $"{filePath}: {OneLine(problem)}";

    private static string OneLine(string text) => text.Replace('\r', ' ').Replace('\n', ' ');
}
