namespace LongRecord.Analysis.Episodes;

/// <summary>
/// The one-kind rule applied after classification: consecutive ectopic beats above the tachycardia rate lasting under
/// the sustained duration are an SVE or VE run (with their EC57 run class); 30 s or longer keep their tachycardia kind.
/// Consecutive ventricular beats under the sustained duration are a VE run at any rate, as EC57 counts runs by beats
/// (a slow run of three to five is still a run of three to five); only a slow ventricular rhythm of 30 s or more is
/// an idioventricular rhythm. Supraventricular ectopic beats likewise: three premature atrial beats in a row are an
/// SVE run whatever their rate, and only 30 s or more of them is a junctional or ectopic atrial rhythm.
/// </summary>
internal static class EpisodeKindRule
{
    public static (string Kind, string RunClass) Apply(string kind, double durationS, int beats, double sustainedS)
    {
        if (durationS < sustainedS)
        {
            if (EpisodeKinds.IsSupraventricularEctopic(kind) || kind is EpisodeKinds.JunctionalRhythm or EpisodeKinds.EctopicAtrialRhythm)
            {
                kind = EpisodeKinds.SveRun;
            }
            else if (kind is EpisodeKinds.BroadTachycardia or EpisodeKinds.IdioventricularRhythm)
            {
                kind = EpisodeKinds.VeRun;
            }
        }

        var runClass = kind is EpisodeKinds.SveRun or EpisodeKinds.VeRun ? (beats >= 6 ? "run-6+" : "run-3-5") : "";
        return (kind, runClass);
    }
}
