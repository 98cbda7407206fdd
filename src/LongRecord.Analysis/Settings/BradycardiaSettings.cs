namespace LongRecord.Analysis.Settings;

/// <summary>Bradycardia episodes: a slow averaged rate held long enough.</summary>
public sealed record BradycardiaSettings
{
    /// <summary>Rate below which the rhythm is bradycardic, bpm (on the averaged rate). 50 bpm: common practice, no source.</summary>
    public double RateBpm { get; init; } = 50;

    /// <summary>Shortest bradycardia episode, seconds. 60 s: common practice, no source.</summary>
    public double MinDurationS { get; init; } = 60;

    internal static readonly SettingField<BradycardiaSettings>[] Fields =
    [
        new("rateBpm", s => s.RateBpm, (s, v) => s with { RateBpm = v }, 20, 80),
        new("minDurationS", s => s.MinDurationS, (s, v) => s with { MinDurationS = v }, 5, 3600),
    ];
}
