namespace LongRecord.Reporting.Model;

/// <summary>
/// The beat-to-beat series reduced for plotting (the Pipeline bins them; a report never holds one point per beat):
/// an RR tachogram in fixed time bins, an RR(n) against RR(n+1) count grid and a heart-rate histogram.
/// </summary>
public sealed record RhythmDistributions
{
    /// <summary>Width of one tachogram bin, seconds.</summary>
    public required double TachogramBinS { get; init; }

    /// <summary>Per bin: lowest, mean and highest RR, ms; NaN where the bin had no usable interval.</summary>
    public required float[] RrMinMs { get; init; }
    public required float[] RrMeanMs { get; init; }
    public required float[] RrMaxMs { get; init; }

    /// <summary>Scatter grid: RR from <see cref="ScatterMinMs"/> in steps of <see cref="ScatterStepMs"/>, both axes.</summary>
    public required double ScatterMinMs { get; init; }
    public required double ScatterStepMs { get; init; }

    /// <summary>Counts, row-major: [RR(n) bin × bins + RR(n+1) bin]; a square grid.</summary>
    public required int[] ScatterCounts { get; init; }
    public required int ScatterBins { get; init; }

    /// <summary>Histogram of beat-to-beat heart rate: first bin starts at <see cref="HistogramMinBpm"/>.</summary>
    public required double HistogramMinBpm { get; init; }
    public required double HistogramStepBpm { get; init; }
    public required int[] HistogramCounts { get; init; }

    /// <summary>An empty set, for a recording with no usable intervals.</summary>
    public static RhythmDistributions Empty { get; } = new()
    {
        TachogramBinS = 60, RrMinMs = [], RrMeanMs = [], RrMaxMs = [],
        ScatterMinMs = 200, ScatterStepMs = 20, ScatterCounts = new int[90 * 90], ScatterBins = 90,
        HistogramMinBpm = 20, HistogramStepBpm = 5, HistogramCounts = new int[46],
    };
}
