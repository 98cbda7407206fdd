namespace LongRecord.Synthesis.Export;

/// <summary>The three files of one synthetic recording.</summary>
public sealed record SyntheticExportPaths(string Edf, string Annotations, string Truth)
{
    /// <summary>Paths beside <paramref name="edfPath"/>: <c>NAME.edf</c>, <c>NAME.atr</c>, <c>NAME.truth.json</c>.</summary>
    public static SyntheticExportPaths For(string edfPath)
    {
        var dir = Path.GetDirectoryName(edfPath) ?? "";
        var name = Path.GetFileNameWithoutExtension(edfPath);
        return new SyntheticExportPaths(edfPath, Path.Combine(dir, name + ".atr"), Path.Combine(dir, name + ".truth.json"));
    }
}
