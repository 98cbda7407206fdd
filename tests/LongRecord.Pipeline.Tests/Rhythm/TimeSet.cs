namespace LongRecord.Pipeline.Tests.Rhythm;

/// <summary>A set of time as sorted, disjoint half-open intervals [start, end) in seconds, for episode scoring.</summary>
public sealed class TimeSet
{
    private readonly List<(double A, double B)> _spans;

    private TimeSet(List<(double A, double B)> spans) => _spans = spans;

    public static TimeSet Empty { get; } = new([]);

    public IReadOnlyList<(double A, double B)> Spans => _spans;

    public double Length
    {
        get
        {
            var sum = 0.0;
            foreach (var (a, b) in _spans)
            {
                sum += b - a;
            }

            return sum;
        }
    }

    /// <summary>The union of <paramref name="spans"/> (any order, overlaps allowed).</summary>
    public static TimeSet Of(IEnumerable<(double A, double B)> spans)
    {
        var list = spans.Where(s => s.B > s.A).OrderBy(s => s.A).ToList();
        var merged = new List<(double A, double B)>();
        foreach (var s in list)
        {
            if (merged.Count > 0 && s.A <= merged[^1].B)
            {
                merged[^1] = (merged[^1].A, Math.Max(merged[^1].B, s.B));
            }
            else
            {
                merged.Add(s);
            }
        }

        return new TimeSet(merged);
    }

    public TimeSet Intersect(TimeSet other)
    {
        var result = new List<(double A, double B)>();
        int i = 0, j = 0;
        while (i < _spans.Count && j < other._spans.Count)
        {
            var a = Math.Max(_spans[i].A, other._spans[j].A);
            var b = Math.Min(_spans[i].B, other._spans[j].B);
            if (b > a)
            {
                result.Add((a, b));
            }

            if (_spans[i].B < other._spans[j].B)
            {
                i++;
            }
            else
            {
                j++;
            }
        }

        return new TimeSet(result);
    }

    public TimeSet Subtract(TimeSet other)
    {
        var result = new List<(double A, double B)>();
        var j = 0;
        foreach (var (a0, b) in _spans)
        {
            var a = a0;
            while (j < other._spans.Count && other._spans[j].B <= a)
            {
                j++;
            }

            var k = j;
            while (k < other._spans.Count && other._spans[k].A < b)
            {
                if (other._spans[k].A > a)
                {
                    result.Add((a, other._spans[k].A));
                }

                a = Math.Max(a, other._spans[k].B);
                k++;
            }

            if (b > a)
            {
                result.Add((a, b));
            }
        }

        return new TimeSet(result);
    }
}
