using System.Globalization;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// Names a candidate by the clinical decision logic for tachycardias (facts of the trade, common practice): first the
/// QRS width (broad may be ventricular and is never called supraventricular without evidence; unknown width leaves
/// the tachycardia unclassified), then regularity, then the atrial activity. Narrow and regular: flutter waves locked
/// at twice the ventricular rate → 2:1 flutter; a P wave before every QRS → sinus tachycardia when it has the sinus
/// shape, focal atrial tachycardia when it does not; no P wave before the QRS → re-entrant SVT. Narrow and irregular:
/// RR clustered at multiples of a flutter cycle → flutter with variable conduction; P waves of three or more shapes →
/// MAT; sinus P waves with frequent premature beats → sinus rhythm with PACs; AF only where the rhythm stage found it.
/// Every answer carries its evidence and a confidence; the short-run rule is applied afterwards (<see cref="EpisodeKindRule"/>).
/// </summary>
internal static class TachycardiaClassifier
{
    // Normal-to-normal intervals needed to judge the rhythm under premature beats (our choice).
    private const int MinNormalIntervals = 8;

    // How far the RR on either side of a sinus tachycardia may differ from its edges' (our choice).
    private const double DriftFraction = 0.1;

    public static (string? Kind, QrsWidth Width, double QrsMs, string Evidence, double Confidence) Classify(ClassifierFacts f, EpisodeSettings s)
    {
        var e = new List<string>();
        var (width, qrsMs) = Width(f, s);
        e.Add(width == QrsWidth.Unknown ? "width unknown" : Invariant($"QRS {qrsMs:0} ms {(width == QrsWidth.Broad ? "broad" : "narrow")} ({WidthSources(f)})"));
        e.Add(RateText(f));
        var irregular = f.Regularity.SuccessiveChange > s.IrregularRrChange;
        e.Add(RegularityText(f, s));
        e.Add(OnsetText(f));
        if (!double.IsNaN(f.Atrial.PBeforeShare))
        {
            // Where noise hid P waves in the sinus beats before, the reviewer sees how often they were found there.
            var sinusP = f.Atrial.SinusPShare;
            e.Add(sinusP < s.SinusPFoundShare
                ? Invariant($"P before QRS in {100 * f.Atrial.PBeforeShare:0} % (in {100 * sinusP:0} % of the sinus beats before it)")
                : Invariant($"P before QRS in {100 * f.Atrial.PBeforeShare:0} %"));
        }

        if (f.Atrial.PShapes > 0)
        {
            e.Add(f.Atrial.PShapes > 1
                ? Invariant($"{f.Atrial.PShapes} P shapes (the commonest {100 * f.Atrial.DominantPShare:0} %)")
                : Invariant($"{f.Atrial.PShapes} P shape(s)"));
        }

        if (!double.IsNaN(f.Atrial.SinusPCorrelation))
        {
            e.Add(Invariant($"P vs sinus P {f.Atrial.SinusPCorrelation:0.00}"));
        }

        if (!double.IsNaN(f.Atrial.AtrialRateBpm))
        {
            e.Add(Invariant($"atrial rate {f.Atrial.AtrialRateBpm:0}/min"));
        }

        if (!double.IsNaN(f.Atrial.ClusterShare))
        {
            e.Add(Invariant($"RR at multiples of the atrial cycle {100 * f.Atrial.ClusterShare:0} % (peak share {100 * f.Atrial.PeakShare:0} %)"));
        }

        if (f.AfShare > 0)
        {
            e.Add(Invariant($"rhythm stage AF over {100 * f.AfShare:0} %"));
        }

        var (kind, confidence) = Decide(f, s, width, irregular, e);
        return (kind, width, qrsMs, string.Join("; ", e), Math.Clamp(confidence, 0, 1));
    }

    /// <summary>
    /// The evidence of an episode whose extent changed after it was classified: the parts measured from its RR
    /// intervals (rate, regularity, onset) restated from <paramref name="f"/>, the new extent's facts; the kind's reasons
    /// and the signal's findings stand.
    /// </summary>
    public static string RestateRrEvidence(string evidence, ClassifierFacts f, EpisodeSettings s)
    {
        var parts = evidence.Split("; ");
        for (var i = 0; i < parts.Length; i++)
        {
            parts[i] = parts[i].StartsWith("rate ", StringComparison.Ordinal) ? RateText(f)
                : parts[i].StartsWith("regular (", StringComparison.Ordinal) || parts[i].StartsWith("irregular (", StringComparison.Ordinal) ? RegularityText(f, s)
                : parts[i].StartsWith("onset ", StringComparison.Ordinal) ? OnsetText(f)
                : parts[i];
        }

        return string.Join("; ", parts);
    }

    private static string RateText(ClassifierFacts f) => Invariant($"rate {f.MeanBpm:0} bpm (median {f.MedianBpm:0})");

    private static string RegularityText(ClassifierFacts f, EpisodeSettings s) => Invariant(
        $"{(f.Regularity.SuccessiveChange > s.IrregularRrChange ? "irregular" : "regular")} (RR change {f.Regularity.SuccessiveChange:0.000}, CV {f.Regularity.Cv:0.000})");

    private static string OnsetText(ClassifierFacts f) => $"onset {f.Onset.Type}{(f.Onset.Trigger != "none" ? $" after a {f.Onset.Trigger} beat" : "")}";

    // The beats' own widths first; the mean complex's only when the beats carry none.
    // Where the width came from, in words: the beats' median and the mean complex's, each only when measured.
    private static string WidthSources(ClassifierFacts f)
    {
        var parts = new List<string>(2);
        if (double.IsFinite(f.BeatQrsMs))
        {
            parts.Add(Invariant($"beats {f.BeatQrsMs:0}"));
        }

        if (double.IsFinite(f.MeanComplexQrsMs))
        {
            parts.Add(Invariant($"mean complex {f.MeanComplexQrsMs:0}"));
        }

        return string.Join(", ", parts);
    }

    private static (QrsWidth, double) Width(ClassifierFacts f, EpisodeSettings s)
    {
        var ms = double.IsNaN(f.BeatQrsMs) ? f.MeanComplexQrsMs : f.BeatQrsMs;
        return double.IsNaN(ms) ? (QrsWidth.Unknown, double.NaN) : (ms >= s.BroadQrsMs ? QrsWidth.Broad : QrsWidth.Narrow, ms);
    }

    private static (string?, double) Decide(ClassifierFacts f, EpisodeSettings s, QrsWidth width, bool irregular, List<string> e)
    {
        var a = f.Atrial;
        var fast = f.MeanBpm >= s.TachycardiaRateBpm;
        var byRhythmStage = f.AfShare >= 0.5;

        // Extra detections in noise: beats of one-off morphologies that split normal intervals. Not an episode. A run
        // the beats stage labelled ectopic beat by beat (ventricular runs often have shapes of their own) needs the
        // split intervals too.
        var labelledRun = (f.Source.HasFlag(CandidateSource.VeRun) && f.VShare >= 0.5) || (f.Source.HasFlag(CandidateSource.SveRun) && f.SShare >= 0.5);
        var oneOff = labelledRun ? f.OddTemplateShare >= 0.25 && f.SplitShare >= 0.3 : f.OddTemplateShare >= 0.5 || (f.OddTemplateShare >= 0.25 && f.SplitShare >= 0.3);
        if (!byRhythmStage && oneOff)
        {
            e.Add(FormattableString.Invariant($"artefact: {100 * f.OddTemplateShare:0} % one-off shapes, {100 * f.SplitShare:0} % split intervals"));
            return (null, 0);
        }

        if (width == QrsWidth.Unknown)
        {
            if (byRhythmStage)
            {
                return (Af(f, s), 0.6);
            }

            if (f.Source.HasFlag(CandidateSource.VeRun) && f.VShare >= 0.5)
            {
                e.Add("consecutive V beats by label");
                return (fast ? EpisodeKinds.VeRun : EpisodeKinds.IdioventricularRhythm, 0.6);
            }

            if (f.Source.HasFlag(CandidateSource.SveRun) && f.SShare >= 0.5)
            {
                e.Add("consecutive S beats by label");
                return (fast ? EpisodeKinds.SveRun : EpisodeKinds.JunctionalRhythm, 0.5);
            }

            return (EpisodeKinds.UnclassifiedTachycardia, 0.3);
        }

        // A QRS unlike the recording's conducted beats, with ventricular beats among them, or with no P wave leading
        // them and few beats the beats stage could call normal or supraventricular, is not called supraventricular
        // without evidence; beats labelled S or N (a supraventricular shape) are that evidence.
        var unusual = f.UsualQrsShare < 0.5 && f.SShare < 0.5
            && (f.VShare >= 0.3 || (a.PBeforeShare <= s.PAbsentShare && f.NShare + f.SShare < 0.5));
        // AF is the rhythm stage's finding (irregular RR, no consistent P waves) and stays AF whatever the width: broad
        // complexes in AF (bundle-branch block, aberration — or a ventricular rhythm) are its attribute, and the width
        // flags the episode urgent in review, so a reviewer sees it first.
        if (byRhythmStage && width == QrsWidth.Broad)
        {
            e.Add("broad QRS during AF: bundle-branch block or aberrant conduction, or ventricular — to be reviewed");
            return (Af(f, s), 0.5);
        }

        if (width == QrsWidth.Broad || f.VShare >= 0.5 || unusual)
        {
            if (width != QrsWidth.Broad)
            {
                e.Add(f.VShare >= 0.5 ? "ventricular beats by morphology" : FormattableString.Invariant($"QRS unlike the usual conducted beats ({100 * f.UsualQrsShare:0} % alike)"));
            }

            if (fast)
            {
                return (EpisodeKinds.BroadTachycardia, width == QrsWidth.Broad && f.VShare >= 0.5 ? 0.9 : 0.7);
            }

            // A slow ventricular rhythm has broad complexes and no P wave leading them; narrow beats with P waves that
            // the beats stage called V are no ectopic rhythm.
            return width == QrsWidth.Broad || a.PBeforeShare < s.PBeforeQrsShare ? (EpisodeKinds.IdioventricularRhythm, 0.7) : (null, 0);
        }

        // Consecutive beats the beats stage labelled S (premature, of a supraventricular shape), under the sustained
        // duration: an SVE run by the EC57 count, whatever the rate, regularity or P waves of so few beats suggest.
        if (!byRhythmStage && f.Source.HasFlag(CandidateSource.SveRun) && f.SShare >= 0.5 && f.DurationS < s.SustainedS)
        {
            e.Add("consecutive S beats by label");
            return (EpisodeKinds.SveRun, 0.6);
        }

        if (!fast)
        {
            if (a.Finding == "flutter-waves" && !SinusPLed(a, s, e))
            {
                return (EpisodeKinds.Flutter, 0.7);
            }

            if (byRhythmStage)
            {
                return (Af(f, s), 0.8);
            }

            return f.Atrial.PBeforeShare >= s.PBeforeQrsShare ? (EpisodeKinds.EctopicAtrialRhythm, 0.6) : (EpisodeKinds.JunctionalRhythm, 0.6);
        }

        var rate = f.MedianBpm;
        if (!irregular)
        {
            if (a.Finding == "flutter-waves-locked" && !SinusPLed(a, s, e))
            {
                return (EpisodeKinds.Flutter, 0.6 + 0.3 * Math.Clamp((a.LockedWaveIndex - s.LockedWaveIndex) / (1 - s.LockedWaveIndex), 0, 1));
            }

            // The share lowered for noise tells an atrial focus from a re-entry when the start is abrupt (both start
            // so); a gradual start is sinus unless P waves are found as often as in clean beats (MITDB 200 at 852 s:
            // a sinus tachycardia whose noisy P shape matched the sinus P at 0.74 read atrial with the lowered share).
            var pPresent = (f.Onset.Type == "abrupt" ? a.PFoundFactor : 1) * s.PBeforeQrsShare;
            if (a.PBeforeShare >= pPresent)
            {
                // A P wave like the sinus P, but a start on a premature atrial beat and most beats premature atrial
                // ones: a focal atrial tachycardia whose focus lies near the sinus node (a sinus tachycardia rises
                // gradually, it does not start on a PAC).
                if (f.Onset is { Type: "abrupt", Trigger: "premature-atrial" } && f.SShare >= 0.5)
                {
                    e.Add("abrupt start on a premature atrial beat; beats premature atrial");
                    return (EpisodeKinds.AtrialTachycardia, 0.5);
                }

                if (!double.IsNaN(a.SinusPCorrelation))
                {
                    return a.SinusPCorrelation >= s.SinusPCorrelation
                        ? (EpisodeKinds.SinusTachycardia, f.Onset.Type == "abrupt" ? 0.6 : 0.9)
                        : UnlikeSinusP(f, e, atrialConfidence: 0.8, sinusConfidence: 0.5);
                }

                // With no sinus P to compare, the edges decide: a sinus tachycardia rises and falls gradually, so an
                // abrupt start, or an abrupt end where the start was not seen (the recording's start, or noise before
                // it), speaks for an atrial focus.
                e.Add("no sinus P to compare");
                var abruptEdge = f.Onset.Type == "abrupt" || (f.Onset.Type == "not-observed" && f.Offset.Type == "abrupt");
                return abruptEdge ? (EpisodeKinds.AtrialTachycardia, 0.4) : (EpisodeKinds.SinusTachycardia, 0.5);
            }

            if (a.PBeforeShare <= s.PAbsentShare || double.IsNaN(a.PBeforeShare))
            {
                var c = 0.5 + (f.Onset.Type == "abrupt" ? 0.2 : 0) + (rate is >= 150 and <= 250 ? 0.15 : 0) + (f.Regularity.SuccessiveChange < 0.03 ? 0.1 : 0);
                return (EpisodeKinds.Svt, c);
            }

            return f.Onset.Type == "abrupt" ? (EpisodeKinds.Svt, 0.4) : (EpisodeKinds.SinusTachycardia, 0.4);
        }

        if (a.Finding == "flutter-waves" && !SinusPLed(a, s, e))
        {
            return (EpisodeKinds.Flutter, 0.8);
        }

        // Sinus rhythm with frequent premature atrial beats: the irregularity is the premature beats' own, and the
        // intervals between two normal beats stay regular. In AF and in multifocal atrial tachycardia the conducted
        // beats themselves come irregularly.
        if (!byRhythmStage && SinusUnderPremature(f, s))
        {
            e.Add(Invariant($"regular between the premature beats (normal-to-normal RR change {f.NormalRegularity.SuccessiveChange:0.000} over {f.NormalRegularity.Intervals} intervals)"));
            return (EpisodeKinds.SinusWithPacs, 0.6);
        }

        // Three or more P shapes with none leading: multifocal. One shape holding most P waves is one pacemaker with
        // premature beats of other shapes.
        if (a.PBeforeShare >= a.PFoundFactor * s.MultifocalPShare && a.PShapes >= s.MultifocalPShapes && !(a.DominantPShare >= s.DominantPShare))
        {
            return (EpisodeKinds.Mat, 0.7);
        }

        // Started abruptly by a premature atrial beat and made mostly of premature atrial beats: an atrial tachycardia
        // (irregular from a focus warming up or from varying conduction), not sinus rhythm with PACs, whose beats are
        // mostly sinus ones between the premature beats. As in the regular case above.
        if (!byRhythmStage && f.Onset is { Type: "abrupt", Trigger: "premature-atrial" } && f.SShare >= 0.5)
        {
            e.Add("abrupt start on a premature atrial beat; beats premature atrial");
            return (EpisodeKinds.AtrialTachycardia, 0.4);
        }

        // The P wave of the sinus beats before the episode before every QRS, and premature beats: sinus with PACs even
        // where the rhythm under them wanders. With no sinus P to compare, only the rule above (regular under them) says so.
        if (a.PBeforeShare >= s.PBeforeQrsShare && f.PrematureShare >= 0.1 && a.SinusPCorrelation >= s.SinusPCorrelation)
        {
            return (EpisodeKinds.SinusWithPacs, 0.6);
        }

        if (byRhythmStage)
        {
            return (Af(f, s), a.Finding == "fibrillatory-waves" ? 0.9 : 0.7);
        }

        // A P wave before every QRS decides by its shape: unlike the sinus P, the rhythm is atrial, not sinus.
        if (a.PBeforeShare >= s.PBeforeQrsShare)
        {
            return a.SinusPCorrelation < s.SinusPCorrelation
                ? UnlikeSinusP(f, e, atrialConfidence: 0.4, sinusConfidence: 0.4)
                : (EpisodeKinds.SinusTachycardia, 0.4);
        }

        // A short narrow run that starts abruptly is a run of supraventricular ectopic beats even when the beats stage
        // did not label them S (the kind rule: consecutive ectopic beats above the tachycardia rate under 30 s).
        if (f.DurationS < s.SustainedS && f.Onset.Type == "abrupt")
        {
            e.Add("short run with an abrupt onset");
            return (EpisodeKinds.SveRun, 0.4);
        }

        return (EpisodeKinds.UnclassifiedTachycardia, 0.3);
    }

    // A P wave like the sinus P before the QRS of most beats: the atria are led by the sinus node, and RR intervals that
    // fall near multiples of a short cycle, or a mean cycle that repeats within itself, are not flutter waves.
    private static bool SinusPLed(AtrialFinding a, EpisodeSettings s, List<string> e)
    {
        var led = a.PBeforeShare >= s.PBeforeQrsShare && a.SinusPCorrelation >= s.SinusPCorrelation;
        if (led)
        {
            e.Add("a P like the sinus P before most QRS: the atrial rate found is not flutter");
        }

        return led;
    }

    // Enough normal-to-normal intervals to judge the rhythm under the premature beats, and that rhythm regular; the
    // premature beats supraventricular ones, and P waves before most QRS. The rhythm under them is sinus when its P is
    // like the sinus P, or cannot be compared, or the rate merely drifts across 100/min (a regular atrial focus with
    // premature beats of its own starts and stops abruptly).
    private static bool SinusUnderPremature(ClassifierFacts f, EpisodeSettings s) =>
        f.PrematureShare >= 0.1 && f.SShare < 0.5 && f.VShare < 0.1
        && f.NormalRegularity.Intervals >= MinNormalIntervals && f.NormalRegularity.SuccessiveChange <= s.IrregularRrChange
        && f.Atrial.PBeforeShare >= s.MultifocalPShare
        && (!(f.Atrial.SinusPCorrelation < s.SinusPCorrelation) || DriftingEdges(f));

    // A sinus tachycardia rises and falls gradually: a rate that drifts across the tachycardia threshold (the RR on
    // either side within 10 % of the episode's edges — a focal atrial tachycardia's warm-up, a few beats that shorten
    // by a fifth or more, does not pass) and few beats labelled premature atrial outweigh a P wave whose shape differs
    // from the resting sinus P — at tachycardia rates the P rides on the preceding T wave, and its measured shape
    // changes with the overlap. 10 %: our choice.
    private static bool SinusEdges(ClassifierFacts f) => f.SShare < 0.5 && DriftingEdges(f);

    // A P before the QRS unlike the sinus P: an atrial focus, unless the episode has a sinus tachycardia's edges.
    private static (string, double) UnlikeSinusP(ClassifierFacts f, List<string> e, double atrialConfidence, double sinusConfidence)
    {
        if (!SinusEdges(f))
        {
            return (EpisodeKinds.AtrialTachycardia, atrialConfidence);
        }

        e.Add("P unlike the sinus P, but the rate drifts across 100/min at both ends without premature atrial beats");
        return (EpisodeKinds.SinusTachycardia, sinusConfidence);
    }

    private static bool DriftingEdges(ClassifierFacts f) =>
        f.Onset.Type == "gradual" && f.Offset.Type == "gradual"
        && f.Onset.Ratio >= 1 - DriftFraction && f.Offset.Ratio <= 1 + DriftFraction;

    // AF keeps the rhythm stage's verdict on its length (af from the minimum AF duration, af-brief below).
    private static string Af(ClassifierFacts f, EpisodeSettings s) => f.RhythmAfLong ? EpisodeKinds.Af : EpisodeKinds.AfBrief;

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
