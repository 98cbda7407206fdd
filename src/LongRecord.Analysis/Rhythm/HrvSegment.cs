namespace LongRecord.Analysis.Rhythm;

/// <summary>One short HRV segment (Task Force 1996: 5 min), aligned like the trend windows.</summary>
public sealed record HrvSegment
{
    public required double StartS { get; init; }
    public required double EndS { get; init; }
    public required int NnCount { get; init; }

    /// <summary>Share of the segment's span covered by NN intervals.</summary>
    public required double NnCoverage { get; init; }

    /// <summary>Coverage reached <c>HrvSettings.MinSegmentNnFraction</c>; otherwise the figures are NaN.</summary>
    public required bool Sufficient { get; init; }

    public required double MeanNnMs { get; init; }
    public required double SdnnMs { get; init; }
    public required double RmssdMs { get; init; }
    public required double LfMs2 { get; init; }
    public required double HfMs2 { get; init; }
    public double LfHfRatio => LfMs2 / HfMs2;
}
