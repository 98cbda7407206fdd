namespace LongRecord.Analysis.Rhythm;

/// <summary>RR irregularity of one short window of consecutive analysable intervals (all RR, not NN only).</summary>
public sealed record IrregularityWindow
{
    public required double StartS { get; init; }
    public required double EndS { get; init; }
    public required int Intervals { get; init; }
    public required double MeanRrMs { get; init; }

    /// <summary>Coefficient of variation: sample SD ÷ mean.</summary>
    public required double Cv { get; init; }

    public required double RmssdMs { get; init; }

    /// <summary>Sample entropy (m and r from the settings); NaN when undefined (no matches).</summary>
    public required double SampleEntropy { get; init; }

    /// <summary>Coefficient of sample entropy; NaN when sample entropy is undefined.</summary>
    public required double Cosen { get; init; }

    /// <summary>Share of the window's intervals inside AF episodes.</summary>
    public required double AfShare { get; init; }
}
