using LongRecord.Analysis.Numerics;

namespace LongRecord.Analysis.Tests.Numerics;

/// <summary>
/// The order statistics the delineator's noise levels, its P-wave correlations and the quality windows' quiet levels
/// rest on, against the definition: the value at position n of the sorted values. Short spans are taken by rank and
/// long ones by partitioning; both must give the sorted array's value, ties and all.
/// </summary>
public sealed class SelectionTests
{
    [Theory]
    [InlineData(1)]
    [InlineData(7)]
    [InlineData(8)]
    [InlineData(23)]
    [InlineData(64)]
    [InlineData(65)]
    [InlineData(200)]
    public void Nth_IsTheSortedValue_AtEveryPosition(int count)
    {
        var random = new Random(count);
        for (var trial = 0; trial < 20; trial++)
        {
            // Every third trial draws from a few levels only, so that many values tie.
            var values = new float[count];
            for (var i = 0; i < count; i++)
            {
                values[i] = trial % 3 == 0 ? random.Next(4) : (float)(random.NextDouble() * 10 - 5);
            }

            var sorted = values.Order().ToArray();
            for (var n = 0; n < count; n++)
            {
                Assert.Equal(sorted[n], Selection.Nth((float[])values.Clone(), n));
            }

            Assert.Equal(sorted[count / 2], Selection.Median((float[])values.Clone()));
        }
    }
}
