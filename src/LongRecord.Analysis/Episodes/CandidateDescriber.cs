using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Rhythm;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Episodes;

/// <summary>A candidate being turned into an episode: its beats and its kind before the short-run rule.</summary>
internal sealed record Draft(Episode Episode, int First, int Last, string RawKind, ClassifierFacts? Facts);

/// <summary>Measures and names one candidate: rates, regularity, onset and offset, the signal's evidence, the kind.</summary>
internal static class CandidateDescriber
{
    /// <summary>
    /// A draft over a new extent: its kind, width and signal evidence stand; the RR measures (rates, onset, offset,
    /// regularity, duration) are taken again over beats <paramref name="first"/>–<paramref name="last"/>, and the
    /// episode is built again from them, so its fields and its evidence agree.
    /// </summary>
    public static Draft Remeasured(Draft d, int first, int last, BeatTrack t, AnalysisSettings settings)
    {
        if (d.Facts is null)
        {
            return d;
        }

        var e = d.Episode;
        var facts = d.Facts with
        {
            MeanBpm = t.MeanBpm(Math.Max(0, first - 1), last),
            MedianBpm = 60 / OnsetOffset.MedianRr(t, first, last),
            Onset = OnsetOffset.Onset(t, first, last, settings.Episodes),
            Offset = OnsetOffset.Offset(t, first, last, settings.Episodes),
            Regularity = RrRegularity.Of(t, first, last),
            DurationS = t.TimeS(last) - t.TimeS(first),
        };
        var episode = Build(t, first, last, d.RawKind, e.Width, e.QrsMs, e.Evidence, e.Confidence, facts, settings);
        return d with { First = first, Last = last, Facts = facts, Episode = episode };
    }

    /// <summary>The candidate as an episode, or null when the evidence makes it none (an artefact, narrow beats with P waves that are not ectopic).</summary>
    public static Draft? Describe(Candidate c, BeatTrack t, IEpisodeSignal? signal, AnalysisSettings settings)
    {
        var s = settings.Episodes;
        var first = c.First;
        var last = c.Last;
        var windows = signal is null ? [] : Windows(signal, t, first, last, s);
        var facts = Facts(c, t, first, last, windows, s);
        var (kind, width, qrsMs, evidence, confidence) = TachycardiaClassifier.Classify(facts, s);
        if (kind is null)
        {
            return null;
        }

        // AF is the rhythm stage's: its episodes keep their own extent.
        if (kind is EpisodeKinds.Af or EpisodeKinds.AfBrief && c.AfPieces.Count > 0)
        {
            (first, last) = AfExtent.Refine(t, t.FirstAtOrAfter(c.AfPieces.Min(p => p.StartS)), t.LastAtOrBefore(c.AfPieces.Max(p => p.EndS)));
            if (first != c.First || last != c.Last)
            {
                facts = Facts(c, t, first, last, windows, s);
            }
        }

        return new Draft(Build(t, first, last, kind, width, qrsMs, evidence, confidence, facts, settings), first, last, kind, facts);
    }

    /// <summary>The episode of beats first … last with these findings (also used when an extent changes).</summary>
    public static Episode Build(BeatTrack t, int first, int last, string kind, QrsWidth width, double qrsMs, string evidence, double confidence,
        ClassifierFacts facts, AnalysisSettings settings)
    {
        var startS = t.TimeS(first);
        var endS = t.TimeS(last);
        var (max, min) = t.Extremes(Math.Max(0, first - 1), last, settings.Rhythm.RateAveragingBeats);
        var (finalKind, runClass) = EpisodeKindRule.Apply(kind, endS - startS, last - first + 1, settings.Episodes.SustainedS);
        return new Episode
        {
            Kind = finalKind,
            StartS = startS,
            EndS = endS,
            Beats = last - first + 1,
            MeanBpm = facts.MeanBpm,
            MaxBpm = max,
            MinBpm = min,
            OnsetObserved = facts.Onset.Type != "not-observed",
            OffsetObserved = facts.Offset.Type != "not-observed",
            QrsMs = qrsMs,
            Width = width,
            Regularity = double.IsNaN(facts.Regularity.SuccessiveChange) ? "" : facts.Regularity.SuccessiveChange > settings.Episodes.IrregularRrChange ? "irregular" : "regular",
            RrCv = facts.Regularity.Cv,
            RunClass = runClass,
            Onset = facts.Onset,
            Offset = facts.Offset,
            Atrial = facts.Atrial,
            Evidence = TachycardiaClassifier.RestateRrEvidence(evidence, facts, settings.Episodes),
            Confidence = confidence,
            // A broad-complex tachycardia may be ventricular, whatever the rhythm around it (AF with broad complexes too).
            Urgent = finalKind is EpisodeKinds.BroadTachycardia || (width == QrsWidth.Broad && facts.MeanBpm >= settings.Episodes.TachycardiaRateBpm),
        };
    }

    public static ClassifierFacts Facts(Candidate c, BeatTrack t, int first, int last, IReadOnlyList<SignalWindow> windows, EpisodeSettings s)
    {
        var regularity = RrRegularity.Of(t, first, last);
        int v = 0, sv = 0, normal = 0, premature = 0;
        var widths = new List<float>();
        for (var i = first; i <= last; i++)
        {
            ref readonly var b = ref t[i];
            v += b.Class == BeatClass.V ? 1 : 0;
            sv += b.Class == BeatClass.S ? 1 : 0;
            normal += b.Class == BeatClass.N ? 1 : 0;
            premature += b.Class is BeatClass.S or BeatClass.V || (b.Flags & BeatFlags.Premature) != 0 ? 1 : 0;
            if (!float.IsNaN(b.QrsMs))
            {
                widths.Add(b.QrsMs);
            }
        }

        var n = last - first + 1;
        int odd = 0, usual = 0;
        for (var i = first; i <= last; i++)
        {
            odd += t[i].Template >= 0 && t.TemplateCount(i) < 3 ? 1 : 0;
            usual += t[i].Template == t.DominantTemplate ? 1 : 0;
        }

        widths.Sort();
        var beatQrs = widths.Count * 2 >= n ? widths[widths.Count / 2] : double.NaN;
        var atrial = windows.Count > 0
            ? AtrialActivity.Measure(windows, t, first, last, regularity, s)
            : AtrialFinding.NotMeasured with { PBeforeShare = AtrialActivity.PBeforeShare(t, first, last) };
        var startS = t.TimeS(first);
        var endS = t.TimeS(last);
        var afS = 0.0;
        foreach (var p in c.AfPieces)
        {
            afS += Math.Max(0, Math.Min(endS, p.EndS) - Math.Max(startS, p.StartS));
        }

        var median = OnsetOffset.MedianRr(t, first, last);
        return new ClassifierFacts
        {
            DurationS = endS - startS,
            MeanBpm = t.MeanBpm(Math.Max(0, first - 1), last),
            MedianBpm = 60 / median,
            BeatQrsMs = beatQrs,
            MeanComplexQrsMs = atrial.MeanComplexQrsMs,
            VShare = (double)v / n,
            SShare = (double)sv / n,
            NShare = (double)normal / n,
            PrematureShare = (double)premature / n,
            OddTemplateShare = (double)odd / n,
            UsualQrsShare = t.DominantTemplate < 0 ? double.NaN : (double)usual / n,
            SplitShare = SplitShare(t, first, last, s),
            Regularity = regularity,
            NormalRegularity = RrRegularity.NormalToNormal(t, first, last),
            Onset = OnsetOffset.Onset(t, first, last, s),
            Offset = OnsetOffset.Offset(t, first, last, s),
            Atrial = atrial,
            AfShare = endS > startS ? afS / (endS - startS) : 0,
            RhythmAfLong = c.AfPieces.Any(p => p.Kind == RhythmEpisode.AfKind),
            Source = c.Source,
        };
    }

    private static double SplitShare(BeatTrack t, int first, int last, EpisodeSettings s)
    {
        var reference = OnsetOffset.MedianRr(t, first - 8, first - 1);
        if (double.IsNaN(reference))
        {
            return 0;
        }

        // Before an irregular rhythm (AF) two short intervals often add up to some earlier interval by chance: a split
        // is recognised only against a steady rhythm (the eight RR before within ± 15 % of their median; our choice).
        for (var i = Math.Max(1, first - 8); i < first; i++)
        {
            if (t.HasRr(i) && Math.Abs(t.RrS[i] - reference) > 0.15 * reference)
            {
                return 0;
            }
        }

        // An extra detection leaves the rhythm's timing alone: the beat after it comes on time. A pause after the
        // candidate (the next RR at least 1.2 times the reference; our choice) is the mark of premature beats, whose
        // short intervals add up to the reference by chance (a compensatory pause after a ventricular run).
        if (last + 1 < t.Count && t.HasRr(last + 1) && t.RrS[last + 1] >= 1.2 * reference)
        {
            return 0;
        }

        var fastRr = 60.0 / s.TachycardiaRateBpm;
        int fast = 0, split = 0;
        for (var i = first; i <= last; i++)
        {
            if (!t.HasRr(i) || t.RrS[i] >= fastRr)
            {
                continue;
            }

            fast++;
            var withNext = i + 1 <= last + 1 && i + 1 < t.Count && t.HasRr(i + 1) && Math.Abs(t.RrS[i] + t.RrS[i + 1] - reference) <= 0.1 * reference;
            var withPrevious = i - 1 >= first && t.HasRr(i - 1) && Math.Abs(t.RrS[i] + t.RrS[i - 1] - reference) <= 0.1 * reference;
            split += withNext || withPrevious ? 1 : 0;
        }

        return fast > 0 ? (double)split / fast : 0;
    }

    /// <summary>The signal to read for beats first … last: with context before (the sinus reference) and, for a long episode, its start and its end only.</summary>
    public static List<SignalWindow> Windows(IEpisodeSignal signal, BeatTrack t, int first, int last, EpisodeSettings s)
    {
        var startS = t.TimeS(first);
        var endS = t.TimeS(last);
        var list = new List<SignalWindow>();
        if (endS - startS <= s.SignalMaxS)
        {
            Add(list, SignalWindow.Read(signal, startS - s.SignalContextS, endS + 2));
        }
        else
        {
            Add(list, SignalWindow.Read(signal, startS - s.SignalContextS, startS + s.SignalMaxS / 2));
            Add(list, SignalWindow.Read(signal, endS - s.SignalMaxS / 2, endS + 2));
        }

        return list;
    }

    private static void Add(List<SignalWindow> list, SignalWindow? w)
    {
        if (w is not null)
        {
            list.Add(w);
        }
    }
}
