namespace LongRecord.Pipeline.Batch;

/// <summary>
/// What a killed run leaves behind for one recording: its temporary folder (<c>.NAME.partial-…</c>) and, when it was
/// killed while replacing an earlier result, that result moved aside (<c>.NAME.old-…</c>). Both are removed before the
/// recording is looked at again; only the recording's own names are touched, so shards sharing an output folder never
/// remove each other's work in progress.
/// </summary>
public static class StaleOutputs
{
    /// <summary>Removes the leftovers of <paramref name="outputName"/> under <paramref name="outputRoot"/>; returns how many.</summary>
    public static int Remove(string outputRoot, string outputName)
    {
        if (!Directory.Exists(outputRoot))
        {
            return 0;
        }

        var removed = 0;
        foreach (var pattern in new[] { $".{outputName}.partial-*", $".{outputName}.old-*" })
        {
            foreach (var dir in Directory.EnumerateDirectories(outputRoot, pattern))
            {
                Directory.Delete(dir, recursive: true);
                removed++;
            }
        }

        return removed;
    }
}
