using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// The rhythm stage: pure computation over a beat list. Builds the RR series, finds AF, pauses and bradycardia, and
/// the rate, HRV and irregularity figures per trend window, per HRV segment and for the whole recording.
/// </summary>
public static class RhythmAnalyser
{
    /// <summary>Analyses <paramref name="input"/> with <paramref name="settings"/> (defaults when null).</summary>
    /// <exception cref="AnalysisSettingsException">The settings have problems.</exception>
    public static RhythmResult Analyse(RhythmInput input, AnalysisSettings? settings = null)
    {
        settings ??= AnalysisSettings.Default;
        var problems = settings.Problems();
        if (problems.Count > 0)
        {
            throw new AnalysisSettingsException("settings", problems);
        }

        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(input.ReferenceRateHz);
        var rr = new RrSeries(input, settings.Rhythm.MaxBeatGapS);
        new AfDetector(settings.Af).Run(rr, input.FWaveScores.Span);
        var af = AfEpisodeBuilder.Build(rr, settings.Af, settings.Rhythm.RateAveragingBeats);
        return new RhythmResult
        {
            Settings = settings,
            Episodes = af,
        };
    }
}
