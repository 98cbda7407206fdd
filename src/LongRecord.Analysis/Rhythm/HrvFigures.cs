namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// Time-domain HRV over a set of NN intervals (Task Force 1996, Table 1). NaN where too few intervals exist.
/// SDNN is the sample standard deviation (n − 1); RMSSD and pNN50 use successive differences of adjacent NN intervals
/// only (two NN intervals sharing a beat); pNN50 divides NN50 (differences above 50 ms) by the number of NN
/// intervals, as the Task Force words it; the triangular index is NN count ÷ height of the NN histogram (bin 1/128 s).
/// </summary>
public sealed record HrvFigures
{
    public static HrvFigures None { get; } = new() { NnCount = 0, MeanNnMs = double.NaN, SdnnMs = double.NaN, RmssdMs = double.NaN, Pnn50Percent = double.NaN, TriangularIndex = double.NaN };

    public required int NnCount { get; init; }
    public required double MeanNnMs { get; init; }
    public required double SdnnMs { get; init; }
    public required double RmssdMs { get; init; }
    public required double Pnn50Percent { get; init; }
    public required double TriangularIndex { get; init; }

    /// <summary>Successive NN differences used by RMSSD and NN50.</summary>
    public int SuccessiveCount { get; init; }

    /// <summary>Pairs of adjacent NN intervals differing by more than 50 ms.</summary>
    public int Nn50Count { get; init; }
}
