using LongRecord.Pipeline.Inputs;
using LongRecord.TestSupport;

namespace LongRecord.Cli.Tests.Batch;

/// <summary>
/// The batch issue's scale-out check: <c>--shard 1/3</c>, <c>2/3</c> and <c>3/3</c> together cover every recording
/// exactly once, into the folder names of a run without shards.
/// </summary>
public sealed class BatchShardTests
{
    [Fact]
    public void ThreeShards_CoverEveryRecordingExactlyOnce_UnderTheUnshardedNames()
    {
        using var input = new TempFolder("batch-shards");
        using var whole = new TempFolder("batch-shards-whole");
        using var sharded = new TempFolder("batch-shards-parts");
        // Seven recordings, two pairs sharing a name in different folders (their names take a hash suffix).
        foreach (var (path, seed) in new[] { ("a/rec.edf", 1), ("b/rec.edf", 2), ("a/night.edf", 3), ("c/night.edf", 4), ("day1.edf", 5), ("day2.edf", 6), ("day3.edf", 7) })
        {
            BatchCli.Synth("sinus-rest", input.Path(path), hours: 0.02, seed: seed);
        }

        var (code, _, stderr) = BatchCli.Run("summarise", input.FullPath, "--out", whole.FullPath);
        Assert.True(code == 0, stderr);
        var expected = Directory.GetDirectories(whole.FullPath).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray();
        Assert.Equal(7, expected.Length);
        Assert.Contains($"rec-{RecordingDiscovery.ShortHash("a/rec.edf")}", expected);

        var taken = new List<string>();
        for (var i = 1; i <= 3; i++)
        {
            (code, _, stderr) = BatchCli.Run("summarise", input.FullPath, "--out", sharded.FullPath, "--shard", $"{i}/3");
            Assert.True(code == 0, stderr);
            var rows = BatchCli.Index(sharded.FullPath, $"index-shard-{i}-of-3.csv");
            Assert.All(rows, r => Assert.Equal("done", r["status"]));
            taken.AddRange(rows.Select(r => r["output"]));
        }

        // Exactly once each: nothing twice, nothing missing, and the same folder names as the whole run.
        Assert.Equal(expected, taken.Order(StringComparer.Ordinal));
        Assert.Equal(expected, Directory.GetDirectories(sharded.FullPath).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        Assert.False(File.Exists(Path.Combine(sharded.FullPath, "index.csv")));

        // After the array job, one run without --shard skips everything and writes the whole index.
        (code, _, stderr) = BatchCli.Run("summarise", input.FullPath, "--out", sharded.FullPath);
        Assert.True(code == 0, stderr);
        var index = BatchCli.Index(sharded.FullPath);
        Assert.Equal(7, index.Count);
        Assert.All(index, r => Assert.Equal("unchanged", r["status"]));
    }

    [Theory]
    [InlineData("0/3")]
    [InlineData("4/3")]
    [InlineData("1/0")]
    [InlineData("one/3")]
    [InlineData("1-3")]
    public void BadShard_IsAUsageError(string shard)
    {
        using var output = new TempFolder("batch-shard-usage");
        var (code, _, stderr) = BatchCli.Run("summarise", "any.edf", "--out", output.FullPath, "--shard", shard);
        Assert.Equal(1, code);
        Assert.Contains("--shard", stderr);
    }
}
