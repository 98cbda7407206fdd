namespace LongRecord.Analysis.Beats;

/// <summary>
/// The last few seconds of every lead, so later stages can take a window around a beat after the detector has
/// decided on it. Fixed size: memory does not grow with recording length.
/// </summary>
public sealed class SignalRing
{
    private readonly float[][] _leads;
    private readonly int _capacity;
    private long _end;

    public SignalRing(int leads, int capacitySamples)
    {
        _capacity = capacitySamples;
        _leads = new float[leads][];
        for (var k = 0; k < leads; k++)
        {
            _leads[k] = new float[capacitySamples];
        }
    }

    /// <summary>One past the last sample appended.</summary>
    public long End => _end;

    /// <summary>The oldest sample still held.</summary>
    public long Start => Math.Max(0, _end - _capacity);

    public int Leads => _leads.Length;

    /// <summary>Appends <paramref name="count"/> samples of every lead (lead-major, lead k at k × count).</summary>
    public void Append(ReadOnlySpan<float> block, int count)
    {
        for (var k = 0; k < _leads.Length; k++)
        {
            var src = block.Slice(k * count, count);
            if (count >= _capacity)
            {
                src = src[(count - _capacity)..];
            }

            var at = (int)((_end + count - src.Length) % _capacity);
            var first = Math.Min(src.Length, _capacity - at);
            src[..first].CopyTo(_leads[k].AsSpan(at));
            src[first..].CopyTo(_leads[k]);
        }

        _end += count;
    }

    /// <summary>
    /// Copies samples [<paramref name="start"/>, start + length) of every lead into <paramref name="destination"/>
    /// (lead-major); the part of the range no longer or not yet held is clipped. Returns the first sample copied and
    /// how many were copied per lead.
    /// </summary>
    public (long First, int Length) CopyWindow(long start, int length, Span<float> destination)
    {
        var first = Math.Max(start, Start);
        var last = Math.Min(start + length, _end);
        var n = (int)Math.Max(0, last - first);
        for (var k = 0; k < _leads.Length; k++)
        {
            var dst = destination.Slice(k * n, n);
            var at = (int)(first % _capacity);
            var firstPart = Math.Min(n, _capacity - at);
            _leads[k].AsSpan(at, firstPart).CopyTo(dst);
            _leads[k].AsSpan(0, n - firstPart).CopyTo(dst[firstPart..]);
        }

        return (first, n);
    }
}
