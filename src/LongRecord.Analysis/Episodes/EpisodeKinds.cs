namespace LongRecord.Analysis.Episodes;

/// <summary>
/// The kind words of <c>episodes.csv</c>, one per episode. The rule that picks one (README, "Episodes"): AF comes from
/// the rhythm stage (<c>af</c> from the minimum AF duration, <c>af-brief</c> below); consecutive ectopic beats above
/// the tachycardia rate lasting under the sustained duration are <c>sve-run</c> or <c>ve-run</c>, longer ones a
/// tachycardia kind; slower ectopic rhythms are idioventricular, junctional or ectopic atrial.
/// </summary>
public static class EpisodeKinds
{
    public const string SinusTachycardia = "sinus-tachycardia";
    public const string AtrialTachycardia = "atrial-tachycardia";
    public const string Svt = "svt";
    public const string Flutter = "flutter";
    public const string Af = "af";
    public const string AfBrief = "af-brief";
    public const string Mat = "mat";
    public const string SinusWithPacs = "sinus-with-pacs";
    public const string BroadTachycardia = "broad-tachycardia";
    public const string Vf = "vf";
    public const string UnclassifiedTachycardia = "unclassified-tachycardia";
    public const string SveRun = "sve-run";
    public const string VeRun = "ve-run";
    public const string IdioventricularRhythm = "idioventricular-rhythm";
    public const string JunctionalRhythm = "junctional-rhythm";
    public const string EctopicAtrialRhythm = "ectopic-atrial-rhythm";
    public const string VentricularBigeminy = "ventricular-bigeminy";
    public const string VentricularTrigeminy = "ventricular-trigeminy";
    public const string AtrialBigeminy = "atrial-bigeminy";
    public const string Pause = "pause";
    public const string Bradycardia = "bradycardia";
    public const string SignalLoss = "signal-loss";

    /// <summary>Every kind, in the order the issue lists them (summary.json counts follow it).</summary>
    public static IReadOnlyList<string> All { get; } =
    [
        SinusTachycardia, AtrialTachycardia, Svt, Flutter, Af, AfBrief, Mat, SinusWithPacs, BroadTachycardia, Vf,
        UnclassifiedTachycardia, SveRun, VeRun, IdioventricularRhythm, JunctionalRhythm, EctopicAtrialRhythm,
        VentricularBigeminy, VentricularTrigeminy, AtrialBigeminy, Pause, Bradycardia, SignalLoss,
    ];

    /// <summary>Kinds that are sustained supraventricular tachycardias of ectopic origin (become sve-run when short).</summary>
    internal static bool IsSupraventricularEctopic(string kind) => kind is AtrialTachycardia or Svt or Flutter or Mat;
}
