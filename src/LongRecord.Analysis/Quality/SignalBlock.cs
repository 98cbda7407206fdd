namespace LongRecord.Analysis.Quality;

/// <summary>Statistics of one lead over one 100 ms block, gathered sample by sample.</summary>
internal struct SignalBlock
{
    public int Valid;
    public int Missing;

    /// <summary>Samples that repeat the previous value for at least the stuck run length.</summary>
    public int Stuck;

    /// <summary>Samples within the rail tolerance of a rail inside a run of equal samples at least a clipping plateau long.</summary>
    public int Railed;

    /// <summary>Samples that repeat the previous value for at least the clipping-plateau run length.</summary>
    public int Plateau;

    public float PlateauMin;
    public float PlateauMax;
    public float RawMin;
    public float RawMax;
    public float CondMin;
    public float CondMax;
    public double CondSum;
    public int CondCount;

    /// <summary>Largest |y[n] − y[n − lag]| of the conditioned signal: the QRS-band slope peak.</summary>
    public float SlopePeak;

    /// <summary>Sample at which <see cref="SlopePeak"/> occurred.</summary>
    public long SlopePeakSample;

    public static SignalBlock Empty => new()
    {
        RawMin = float.PositiveInfinity,
        RawMax = float.NegativeInfinity,
        PlateauMin = float.PositiveInfinity,
        PlateauMax = float.NegativeInfinity,
        CondMin = float.PositiveInfinity,
        CondMax = float.NegativeInfinity,
    };

    public readonly float CondMean => CondCount > 0 ? (float)(CondSum / CondCount) : float.NaN;
}
