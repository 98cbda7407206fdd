using LongRecord.Pipeline.Batch;

namespace LongRecord.Pipeline.Tests.Batch;

/// <summary><c>--shard I/N</c> (batch issue, "Scale-out"): a deterministic 1/N of the whole sorted list.</summary>
public sealed class ShardSpecTests
{
    [Theory]
    [InlineData(0, 3)]
    [InlineData(1, 3)]
    [InlineData(7, 3)]
    [InlineData(10, 4)]
    [InlineData(5, 1)]
    [InlineData(2, 5)]
    public void ShardsTogether_TakeEveryItemExactlyOnce_InListOrder(int items, int shards)
    {
        var list = Enumerable.Range(0, items).Select(i => $"r{i:D2}").ToArray();
        var parts = Enumerable.Range(1, shards).Select(i => new ShardSpec(i, shards).Select(list)).ToArray();
        Assert.Equal(list, parts.SelectMany(p => p).Order(StringComparer.Ordinal));
        Assert.All(parts, p => Assert.Equal(p.Order(StringComparer.Ordinal), p));
        // Balanced: sizes differ by at most one.
        Assert.True(parts.Max(p => p.Count) - parts.Min(p => p.Count) <= 1);
    }

    [Theory]
    [InlineData("2/8", 2, 8)]
    [InlineData("1/1", 1, 1)]
    [InlineData("8/8", 8, 8)]
    public void Parse_AcceptsIOverN(string text, int index, int count)
    {
        Assert.True(ShardSpec.TryParse(text, out var shard, out _));
        Assert.Equal(new ShardSpec(index, count), shard);
    }

    [Theory]
    [InlineData("0/8")]
    [InlineData("9/8")]
    [InlineData("-1/8")]
    [InlineData("2")]
    [InlineData("2/8/1")]
    [InlineData("")]
    public void Parse_RejectsAnythingElse(string text) => Assert.False(ShardSpec.TryParse(text, out _, out _));
}
