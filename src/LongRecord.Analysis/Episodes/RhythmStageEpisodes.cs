using LongRecord.Analysis.Rhythm;

namespace LongRecord.Analysis.Episodes;

/// <summary>The rhythm stage's pauses and bradycardias as episodes (AF goes through the candidates, for its atrial evidence).</summary>
internal static class RhythmStageEpisodes
{
    public static IEnumerable<Episode> PausesAndBradycardia(RhythmResult rhythm)
    {
        foreach (var e in rhythm.Episodes)
        {
            if (e.Kind is not (RhythmEpisode.PauseKind or RhythmEpisode.BradycardiaKind))
            {
                continue;
            }

            var pause = e.Kind == RhythmEpisode.PauseKind;
            yield return new Episode
            {
                Kind = pause ? EpisodeKinds.Pause : EpisodeKinds.Bradycardia,
                StartS = e.StartS,
                EndS = e.EndS,
                Beats = e.Beats,
                MeanBpm = e.MeanBpm,
                MaxBpm = e.MaxBpm,
                MinBpm = e.MinBpm,
                OnsetObserved = e.OnsetObserved,
                OffsetObserved = e.OffsetObserved,
                Highlighted = e.Highlighted,
                Context = e.Context,
                PossibleAvBlock = e.PossibleAvBlock,
                Evidence = pause
                    ? FormattableString.Invariant($"RR {e.DurationS:0.00} s{(e.Context == PauseContext.DuringAf ? " during AF" : e.Context == PauseContext.AfterPremature ? " after a premature beat" : "")}{(e.PossibleAvBlock ? "; P wave without QRS inside: possible AV block" : "")}")
                    : FormattableString.Invariant($"rate below the bradycardia rate for {e.DurationS:0} s (lowest {e.MinBpm:0} bpm)"),
            };
        }
    }
}
