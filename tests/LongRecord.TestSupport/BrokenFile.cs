namespace LongRecord.TestSupport;

/// <summary>
/// One member of the broken-file corpus: bytes made in a test from a good file, and what the reader must say.
/// Each format's tests contribute a corpus; an aggregate test opens all of them through the format detector.
/// </summary>
/// <param name="Name">Short case name, unique across the corpus (for example <c>edf-digital-min-equals-max</c>).</param>
/// <param name="FileName">Name of the file to open (for WFDB, the header).</param>
/// <param name="Content">Bytes of <paramref name="FileName"/>.</param>
/// <param name="ExpectedProblem">A fragment the one-line message must contain, specific to this case.</param>
/// <param name="ExpectedByteOffset">Byte offset the error must report, or null when it has none.</param>
/// <param name="SideFiles">Other files the case needs beside it (WFDB signal or annotation files), by name.</param>
/// <param name="FailsOnRead">True when opening succeeds and only reading samples must fail.</param>
public sealed record BrokenFile(
    string Name,
    string FileName,
    byte[] Content,
    string ExpectedProblem,
    long? ExpectedByteOffset = null,
    IReadOnlyDictionary<string, byte[]>? SideFiles = null,
    bool FailsOnRead = false)
{
    public override string ToString() => Name;
}
