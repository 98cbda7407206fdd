namespace LongRecord.Pipeline.Inputs;

/// <summary>One recording to summarise: where it is, how it is named relative to its input root, and its output folder name.</summary>
/// <param name="Path">File to open (for WFDB, the header).</param>
/// <param name="RelativePath">Path relative to the input root it was found under (the file name when given directly).</param>
/// <param name="Name">Recording name: the WFDB record name, or the file name without its extension.</param>
/// <param name="OutputName">Folder name under the output root: <see cref="Name"/>, with a hash suffix when names collide.</param>
public sealed record RecordingInput(string Path, string RelativePath, string Name, string OutputName);
