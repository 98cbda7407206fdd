namespace LongRecord.TestSupport;

/// <summary>A fresh folder under the system temp directory, deleted on dispose.</summary>
public sealed class TempFolder : IDisposable
{
    public TempFolder(string? prefix = null)
    {
        FullPath = System.IO.Path.Combine(System.IO.Path.GetTempPath(), $"longrecord-{prefix ?? "test"}-{Guid.NewGuid():N}");
        Directory.CreateDirectory(FullPath);
    }

    public string FullPath { get; }

    public string Path(string name) => System.IO.Path.Combine(FullPath, name);

    public string Write(string name, byte[] content)
    {
        var p = Path(name);
        Directory.CreateDirectory(System.IO.Path.GetDirectoryName(p)!);
        File.WriteAllBytes(p, content);
        return p;
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(FullPath, recursive: true);
        }
        catch (IOException)
        {
        }
    }
}
