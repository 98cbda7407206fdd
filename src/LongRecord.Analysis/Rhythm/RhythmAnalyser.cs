using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// The rhythm stage: pure computation over a beat list. Builds the RR series, finds AF (<see cref="AfDetector"/>),
/// pauses and bradycardia, selects NN intervals, and gives rate, HRV and irregularity figures per trend window, per
/// HRV segment and for the whole recording. Working memory about 8 bytes per beat besides the result.
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
        var fWave = input.FWaveScores.Span;
        if (fWave.Length != 0 && fWave.Length != input.Beats.Length)
        {
            throw new ArgumentException("FWaveScores must hold one score per beat, or none", nameof(input));
        }

        var rr = new RrSeries(input, settings.Rhythm.MaxBeatGapS);
        new AfDetector(settings.Af).Run(rr, fWave);
        var k = settings.Rhythm.RateAveragingBeats;
        var af = AfEpisodeBuilder.Build(rr, settings.Af, k);
        NnSelector.Mark(rr, settings.Hrv);
        var nonConducted = input.NonConductedPSamples.Order().ToArray();
        var pauses = PauseFinder.Find(rr, settings.Pauses, nonConducted);
        var brady = BradycardiaFinder.Find(rr, settings.Bradycardia, k);
        var episodes = af.Concat(pauses).Concat(brady).OrderBy(e => e.StartS).ThenBy(e => e.Kind, StringComparer.Ordinal).ToList();
        var trendGrid = new WindowGrid(input.DurationS, settings.Rhythm.TrendWindowS, input.StartDateTime, settings.Rhythm.AlignToClock);
        var segmentGrid = new WindowGrid(input.DurationS, settings.Hrv.SegmentS, input.StartDateTime, settings.Rhythm.AlignToClock);
        var segments = TrendBuilder.Segments(rr, segmentGrid, settings.Hrv);
        return new RhythmResult
        {
            Settings = settings,
            Episodes = episodes,
            Trend = TrendBuilder.Build(rr, trendGrid, settings, pauses),
            HrvSegments = segments,
            Irregularity = IrregularityBuilder.Build(rr, settings.Irregularity),
            Summary = SummaryBuilder.Build(rr, input, settings, episodes, segments),
        };
    }
}
