namespace LongRecord.Pipeline.Outputs;

/// <summary>
/// A recording's output folder built under a temporary name beside its final place and renamed only when complete,
/// so no half-written result ever appears under the final name. Dispose without <see cref="Commit"/> deletes it.
/// </summary>
public sealed class OutputFolder : IDisposable
{
    private bool _committed;

    public OutputFolder(string finalPath)
    {
        FinalPath = Path.GetFullPath(finalPath);
        var parent = Path.GetDirectoryName(FinalPath)!;
        Directory.CreateDirectory(parent);
        WorkPath = Path.Combine(parent, $".{Path.GetFileName(FinalPath)}.partial-{Guid.NewGuid():N}");
        Directory.CreateDirectory(WorkPath);
    }

    public string FinalPath { get; }

    /// <summary>Where files are written until <see cref="Commit"/>.</summary>
    public string WorkPath { get; }

    public string File(string name) => Path.Combine(WorkPath, name);

    /// <summary>Moves the finished folder to its final name, replacing an earlier result there.</summary>
    public void Commit()
    {
        if (Directory.Exists(FinalPath))
        {
            var old = Path.Combine(Path.GetDirectoryName(FinalPath)!, $".{Path.GetFileName(FinalPath)}.old-{Guid.NewGuid():N}");
            Directory.Move(FinalPath, old);
            Directory.Move(WorkPath, FinalPath);
            Directory.Delete(old, recursive: true);
        }
        else
        {
            Directory.Move(WorkPath, FinalPath);
        }

        _committed = true;
    }

    public void Dispose()
    {
        if (!_committed && Directory.Exists(WorkPath))
        {
            Directory.Delete(WorkPath, recursive: true);
        }
    }
}
