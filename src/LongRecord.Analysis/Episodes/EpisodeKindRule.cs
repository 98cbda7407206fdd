namespace LongRecord.Analysis.Episodes;

/// <summary>
/// The one-kind rule applied after classification: consecutive ectopic beats above the tachycardia rate lasting under
/// the sustained duration are an SVE or VE run (with their EC57 run class); 30 s or longer keep their tachycardia kind.
/// </summary>
internal static class EpisodeKindRule
{
    public static (string Kind, string RunClass) Apply(string kind, double durationS, int beats, double sustainedS)
    {
        if (durationS < sustainedS)
        {
            if (EpisodeKinds.IsSupraventricularEctopic(kind))
            {
                kind = EpisodeKinds.SveRun;
            }
            else if (kind == EpisodeKinds.BroadTachycardia)
            {
                kind = EpisodeKinds.VeRun;
            }
        }

        var runClass = kind is EpisodeKinds.SveRun or EpisodeKinds.VeRun ? (beats >= 6 ? "run-6+" : "run-3-5") : "";
        return (kind, runClass);
    }
}
