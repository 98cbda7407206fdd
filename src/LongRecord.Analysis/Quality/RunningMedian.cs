namespace LongRecord.Analysis.Quality;

/// <summary>
/// Median of the last <c>capacity</c> values: a sorted copy is kept beside the values in arrival order, so a new value
/// costs two binary searches and two short moves, and the median is read directly.
/// </summary>
internal sealed class RunningMedian
{
    private readonly float[] _arrival;
    private readonly float[] _sorted;
    private int _count;
    private int _next;

    public RunningMedian(int capacity)
    {
        _arrival = new float[capacity];
        _sorted = new float[capacity];
    }

    public int Count => _count;

    /// <summary>The upper median (element <c>Count / 2</c> in ascending order), or 0 when empty.</summary>
    public float Median => _count == 0 ? 0 : _sorted[_count / 2];

    public void Add(float value)
    {
        if (_count == _arrival.Length)
        {
            var old = _arrival[_next];
            // Span searches compare inline (Array.BinarySearch goes through a comparer object): the same positions
            // among equal values do not matter, any of them gives the same sorted array.
            var at = _sorted.AsSpan(0, _count).BinarySearch(old);
            Array.Copy(_sorted, at + 1, _sorted, at, _count - at - 1);
            _count--;
        }

        var insert = _sorted.AsSpan(0, _count).BinarySearch(value);
        if (insert < 0)
        {
            insert = ~insert;
        }

        Array.Copy(_sorted, insert, _sorted, insert + 1, _count - insert);
        _sorted[insert] = value;
        _count++;
        _arrival[_next] = value;
        _next = (_next + 1) % _arrival.Length;
    }
}
