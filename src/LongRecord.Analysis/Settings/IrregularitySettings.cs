namespace LongRecord.Analysis.Settings;

/// <summary>RR irregularity over short sliding beat windows.</summary>
public sealed record IrregularitySettings
{
    /// <summary>RR intervals per window. 64: common practice for entropy on short series, no source.</summary>
    public int WindowBeats { get; init; } = 64;

    /// <summary>RR intervals the window moves on between windows (equal to the length: windows touch).</summary>
    public int HopBeats { get; init; } = 64;

    /// <summary>Template length m of sample entropy (Richman and Moorman, Am J Physiol 2000;278:H2039-H2049): 2.</summary>
    public int SampleEntropyM { get; init; } = 2;

    /// <summary>Tolerance r of sample entropy as a fraction of the window's RR standard deviation: 0.2 (Richman and Moorman 2000).</summary>
    public double SampleEntropyR { get; init; } = 0.2;

    internal static readonly SettingField<IrregularitySettings>[] Fields =
    [
        new("windowBeats", s => s.WindowBeats, (s, v) => s with { WindowBeats = (int)v }, 8, 1024, whole: true),
        new("hopBeats", s => s.HopBeats, (s, v) => s with { HopBeats = (int)v }, 1, 1024, whole: true),
        new("sampleEntropyM", s => s.SampleEntropyM, (s, v) => s with { SampleEntropyM = (int)v }, 1, 5, whole: true),
        new("sampleEntropyR", s => s.SampleEntropyR, (s, v) => s with { SampleEntropyR = v }, 0.01, 2),
    ];
}
