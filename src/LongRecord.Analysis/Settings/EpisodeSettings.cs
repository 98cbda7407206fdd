namespace LongRecord.Analysis.Settings;

/// <summary>Thresholds of the episode stage (tachycardia, runs, bigeminy), kept here so one file holds every threshold.</summary>
public sealed record EpisodeSettings
{
    /// <summary>Rate above which a run is a tachycardia, bpm. 100 bpm: common practice, no source.</summary>
    public double TachycardiaRateBpm { get; init; } = 100;

    /// <summary>Fewest consecutive ectopic beats that make a run (two make a couplet). 3: common practice, no source.</summary>
    public int RunMinimumBeats { get; init; } = 3;

    /// <summary>Fewest normal–ectopic cycles in a row that make bigeminy. 3: common practice, no source.</summary>
    public int BigeminyMinimumCycles { get; init; } = 3;

    internal static readonly SettingField<EpisodeSettings>[] Fields =
    [
        new("tachycardiaRateBpm", s => s.TachycardiaRateBpm, (s, v) => s with { TachycardiaRateBpm = v }, 60, 250),
        new("runMinimumBeats", s => s.RunMinimumBeats, (s, v) => s with { RunMinimumBeats = (int)v }, 3, 100, whole: true),
        new("bigeminyMinimumCycles", s => s.BigeminyMinimumCycles, (s, v) => s with { BigeminyMinimumCycles = (int)v }, 2, 100, whole: true),
    ];
}
