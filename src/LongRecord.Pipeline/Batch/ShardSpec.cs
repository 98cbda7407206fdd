using System.Globalization;

namespace LongRecord.Pipeline.Batch;

/// <summary>
/// <c>--shard I/N</c>: the I-th of N deterministic parts of the whole sorted input list. Recording k (0-based, in the
/// sorted list) belongs to shard <c>k mod N + 1</c>, so shards differ by at most one recording and, because the list and
/// the output names are decided before sharding, a recording lands in the same folder whichever shard runs it.
/// </summary>
public readonly record struct ShardSpec(int Index, int Count)
{
    /// <summary>The whole list (no sharding).</summary>
    public static ShardSpec All { get; } = new(1, 1);

    public bool IsWhole => Count == 1;

    /// <summary>Parses <c>I/N</c> with 1 ≤ I ≤ N; the message of a bad value says what is expected.</summary>
    public static bool TryParse(string? text, out ShardSpec shard, out string problem)
    {
        shard = All;
        problem = "";
        var parts = (text ?? "").Split('/');
        if (parts.Length != 2
            || !int.TryParse(parts[0], NumberStyles.None, CultureInfo.InvariantCulture, out var index)
            || !int.TryParse(parts[1], NumberStyles.None, CultureInfo.InvariantCulture, out var count))
        {
            problem = $"--shard '{text}': expected I/N, for example 2/8";
            return false;
        }

        if (count < 1 || index < 1 || index > count)
        {
            problem = $"--shard '{text}': I must be from 1 to N";
            return false;
        }

        shard = new ShardSpec(index, count);
        return true;
    }

    /// <summary>True when the recording at <paramref name="position"/> of the whole sorted list is in this shard.</summary>
    public bool Contains(int position) => position % Count == Index - 1;

    /// <summary>This shard's part of the whole sorted list, in list order.</summary>
    public IReadOnlyList<T> Select<T>(IReadOnlyList<T> whole)
    {
        var mine = new List<T>(whole.Count / Count + 1);
        for (var i = 0; i < whole.Count; i++)
        {
            if (Contains(i))
            {
                mine.Add(whole[i]);
            }
        }

        return mine;
    }

    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Index}/{Count}");
}
