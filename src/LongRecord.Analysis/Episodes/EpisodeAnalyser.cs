using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// The episode stage: pure computation over the beats, the quality stretches and the rhythm stage's result, with the
/// signal read on request for the candidates only. Finds candidates (fast runs, ectopic runs, the rhythm stage's AF),
/// measures and classifies each (<see cref="TachycardiaClassifier"/>), adds bigeminy and trigeminy, pauses and
/// bradycardia, and the urgent signal findings, then ranks them for review and tabulates the symptom events.
/// </summary>
public static class EpisodeAnalyser
{
    /// <summary>Analyses <paramref name="input"/>; <paramref name="signal"/> null when the beats have no signal behind them.</summary>
    /// <exception cref="AnalysisSettingsException">The settings have problems.</exception>
    public static EpisodeResult Analyse(EpisodeInput input, AnalysisSettings? settings = null, IEpisodeSignal? signal = null)
    {
        settings ??= AnalysisSettings.Default;
        var problems = settings.Problems();
        if (problems.Count > 0)
        {
            throw new AnalysisSettingsException("settings", problems);
        }

        var s = settings.Episodes;
        var track = new BeatTrack(input.Beats, input.ReferenceRateHz, input.Stretches, settings.Rhythm.MaxBeatGapS);
        var candidates = CandidateFinder.Find(track, input.Rhythm, s, out var sveCouplets, out var veCouplets);
        var drafts = new List<Draft>();
        foreach (var c in candidates)
        {
            if (CandidateDescriber.Describe(c, track, signal, settings) is Draft d)
            {
                drafts.Add(d);
            }
        }

        drafts = FlutterExtent.Extend(drafts, track, settings);
        drafts = EpisodeFragments.Absorb(drafts, track, settings);

        var episodes = drafts.Select(d => d.Episode).ToList();
        foreach (var (first, last, kind, cycles) in BigeminyFinder.Find(track, s))
        {
            // Alternating S labels inside AF, flutter or a supraventricular tachycardia are that rhythm's irregularity,
            // not atrial bigeminy; ventricular beats keep their bigeminy whatever the rhythm underneath.
            var b = Bigeminy(track, first, last, kind, cycles, settings);
            if (kind != EpisodeKinds.AtrialBigeminy || !drafts.Any(d => d.Episode.Beats >= 8 && Overlap(d.Episode, b) >= 0.5 * b.DurationS))
            {
                episodes.Add(b);
            }
        }

        episodes.AddRange(RhythmStageEpisodes.PausesAndBradycardia(input.Rhythm));
        episodes.AddRange(UrgentStretches.Find(input.Stretches, track, signal, s));
        episodes = episodes.OrderBy(e => e.StartS).ThenBy(e => e.Kind, StringComparer.Ordinal).Select((e, i) => e with { Id = i + 1 }).ToList();
        episodes = EpisodeReview.Apply(episodes, input.Events, input.DurationS, s);
        var table = SymptomTable.Build(input.Events, episodes, track, input.StartDateTime, s.SymptomWindowS, settings.Rhythm.RateAveragingBeats);
        return new EpisodeResult
        {
            Episodes = episodes,
            SymptomEvents = table,
            SveCouplets = sveCouplets,
            VeCouplets = veCouplets,
            SignalAnalysed = signal is not null,
        };
    }

    private static double Overlap(Episode a, Episode b) => Math.Max(0, Math.Min(a.EndS, b.EndS) - Math.Max(a.StartS, b.StartS));

    private static Episode Bigeminy(BeatTrack t, int first, int last, string kind, int cycles, AnalysisSettings settings)
    {
        var (max, min) = t.Extremes(first, last, settings.Rhythm.RateAveragingBeats);
        return new Episode
        {
            Kind = kind,
            StartS = t.TimeS(first),
            EndS = t.TimeS(last),
            Beats = last - first + 1,
            MeanBpm = t.MeanBpm(first, last),
            MaxBpm = max,
            MinBpm = min,
            OnsetObserved = t.HasRr(first),
            OffsetObserved = t.HasRr(last + 1 < t.Count ? last + 1 : last),
            Evidence = FormattableString.Invariant($"{cycles} {(kind == EpisodeKinds.VentricularTrigeminy ? "normal-normal-V" : kind == EpisodeKinds.AtrialBigeminy ? "normal-S" : "normal-V")} cycles in a row"),
            Confidence = 0.8,
        };
    }
}
