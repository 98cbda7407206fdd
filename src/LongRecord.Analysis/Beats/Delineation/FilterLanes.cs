namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>Up to four (source, filter, destination) lanes of one length for <see cref="ZeroPhaseLowPass.Run"/>.</summary>
internal ref struct FilterLanes
{
    private ReadOnlySpan<float> _s0, _s1, _s2, _s3;
    private Span<float> _d0, _d1, _d2, _d3;
    private ZeroPhaseLowPass? _f0, _f1, _f2, _f3;

    public int Count { get; private set; }

    public int Length { get; private set; }

    public readonly bool Full => Count == 4;

    /// <summary>Adds a lane; every lane must have the length of the first, and a destination may not overlap a source.</summary>
    public void Add(ReadOnlySpan<float> source, ZeroPhaseLowPass filter, Span<float> destination)
    {
        if (Count == 4)
        {
            throw new InvalidOperationException("at most four lanes");
        }

        if (Count == 0)
        {
            Length = source.Length;
        }

        if (source.Length != Length || destination.Length != Length)
        {
            throw new ArgumentException("every lane must have one length");
        }

        switch (Count++)
        {
            case 0:
                _s0 = source;
                _f0 = filter;
                _d0 = destination;
                break;
            case 1:
                _s1 = source;
                _f1 = filter;
                _d1 = destination;
                break;
            case 2:
                _s2 = source;
                _f2 = filter;
                _d2 = destination;
                break;
            default:
                _s3 = source;
                _f3 = filter;
                _d3 = destination;
                break;
        }
    }

    /// <summary>Runs the lanes (see <see cref="ZeroPhaseLowPass.Run"/>) and empties the set.</summary>
    public void Flush(Span<double> work)
    {
        ZeroPhaseLowPass.Run(ref this, work);
        this = default;
    }

    public readonly ReadOnlySpan<float> Source(int k) => k switch { 0 => _s0, 1 => _s1, 2 => _s2, _ => _s3 };

    public readonly Span<float> Destination(int k) => k switch { 0 => _d0, 1 => _d1, 2 => _d2, _ => _d3 };

    public readonly ZeroPhaseLowPass Filter(int k) => (k switch { 0 => _f0, 1 => _f1, 2 => _f2, _ => _f3 })!;
}
