using LongRecord.Analysis.Episodes;
using LongRecord.Synthesis;
using LongRecord.Synthesis.Truth;

namespace LongRecord.Pipeline.Tests.Episodes;

/// <summary>An episode the synthesiser scripted, with the kind the episode stage should give it.</summary>
public sealed record TruthEpisode(string Scenario, string Kind, double StartS, double EndS, int Beats, OnsetType Onset, OnsetType Offset);

/// <summary>
/// The synthesiser's truth (fixtures/scenarios/README.md, "What the truth means") mapped onto episode kinds by the
/// issue's rule: scripted tachycardia segments take their kind (an ectopic one under 30 s is a run), episodes inside
/// segments keep theirs; for a gradual sinus tachycardia the extent is from the first to the last sinus beat above
/// 100 bpm (the issue: "the true onset is the first beat above the tachycardia rate"; premature atrial beats, whose
/// own RR is short, are not the sinus rate). Couplets are not episodes (EC57 counts them apart).
/// </summary>
public static class SyntheticTruthEpisodes
{
    public static List<TruthEpisode> Of(string scenario, SyntheticRecording rec, double sustainedS = 30)
    {
        var list = new List<TruthEpisode>();
        foreach (var r in rec.Truth.Rhythms)
        {
            var kind = r.Kind switch
            {
                "sinus-tachycardia" => scenario == "sinus-tachycardia-pacs" ? EpisodeKinds.SinusWithPacs : EpisodeKinds.SinusTachycardia,
                "focal-atrial-tachycardia" => r.DurationS >= sustainedS ? EpisodeKinds.AtrialTachycardia : EpisodeKinds.SveRun,
                "psvt" => r.DurationS >= sustainedS ? EpisodeKinds.Svt : EpisodeKinds.SveRun,
                "atrial-flutter" => r.DurationS >= sustainedS ? EpisodeKinds.Flutter : EpisodeKinds.SveRun,
                "mat" => r.DurationS >= sustainedS ? EpisodeKinds.Mat : EpisodeKinds.SveRun,
                "af" => r.DurationS >= sustainedS ? EpisodeKinds.Af : EpisodeKinds.AfBrief,
                "broad-complex-tachycardia" => r.DurationS >= sustainedS ? EpisodeKinds.BroadTachycardia : EpisodeKinds.VeRun,
                "sve-run" => EpisodeKinds.SveRun,
                "ve-run" => EpisodeKinds.VeRun,
                "ventricular-bigeminy" => EpisodeKinds.VentricularBigeminy,
                "ventricular-trigeminy" => EpisodeKinds.VentricularTrigeminy,
                "ventricular-flutter" or "ventricular-fibrillation" => EpisodeKinds.Vf,
                "pause" => EpisodeKinds.Pause,
                "sinus-bradycardia" => EpisodeKinds.Bradycardia,
                _ => null,
            };
            if (kind is null)
            {
                continue;
            }

            var (start, end) = (r.StartS, r.EndS);
            if (r.Kind == "sinus-tachycardia")
            {
                (start, end) = SinusAbove(rec, r, 100);
            }

            list.Add(new TruthEpisode(scenario, kind, start, end, r.BeatCount, r.Onset, r.Offset));
        }

        foreach (var n in rec.Truth.Noise)
        {
            if (n.Kind == "lead-off" && n.LeadOffMode == "flat" && (n.Leads.Count == 0 || n.Leads.Count == rec.Scenario.Leads.Count))
            {
                list.Add(new TruthEpisode(scenario, EpisodeKinds.SignalLoss, n.StartS, n.EndS, 0, OnsetType.Abrupt, OnsetType.Abrupt));
            }
        }

        return list;
    }

    private static (double, double) SinusAbove(SyntheticRecording rec, RhythmInterval r, double bpm)
    {
        double first = double.NaN, last = double.NaN;
        var beats = rec.Truth.Beats;
        for (var i = 1; i < beats.Count; i++)
        {
            var b = beats[i];
            if (b.RTimeS < r.StartS || b.RTimeS > r.EndS || b.Class != BeatClass.N || beats[i - 1].Class != BeatClass.N)
            {
                continue;
            }

            if (60.0 / (b.RTimeS - beats[i - 1].RTimeS) > bpm)
            {
                first = double.IsNaN(first) ? b.RTimeS : first;
                last = b.RTimeS;
            }
        }

        return (first, last);
    }
}
