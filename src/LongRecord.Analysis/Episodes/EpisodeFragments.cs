using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// One tachycardia is one episode. A short piece (under the sustained duration) inside a longer episode of a related
/// kind, or beside it across at most the fragment gap, is part of that episode, not a new one: the host takes the
/// piece's beats and keeps its own kind. Related: an ectopic supraventricular tachycardia (focal atrial, SVT, flutter,
/// MAT) and the narrow pieces the beats stage cuts from it (<c>sve-run</c>, <c>sinus-tachycardia</c>, a narrow or
/// unknown-width <c>unclassified-tachycardia</c>); a sinus tachycardia and its narrow regular pieces (not its runs of
/// PACs, which are episodes of their own); a broad-complex tachycardia and its <c>ve-run</c> and broad pieces. A
/// <c>ve-run</c> inside AF or a sinus tachycardia stays its own episode, as does anything beside AF (AF is the rhythm
/// stage's, with its own extent); a narrow junctional or ectopic atrial rhythm wholly inside AF is part of it. Two episodes of one ectopic tachycardia kind that near are one, whatever their
/// lengths. A candidate of fewer than the minimum run of beats is no episode.
/// </summary>
internal static class EpisodeFragments
{
    public static List<Draft> Absorb(List<Draft> drafts, BeatTrack t, AnalysisSettings settings)
    {
        var s = settings.Episodes;
        var list = drafts.Where(d => d.Last - d.First + 1 >= s.RunMinimumBeats).OrderBy(d => d.First).ToList();
        var startS = list.Select(d => t.TimeS(d.First)).ToArray();
        // By reference: drafts are records, and two with equal values are still two drafts.
        var current = new Dictionary<Draft, Draft>(ReferenceEqualityComparer.Instance);
        foreach (var d in list)
        {
            current[d] = d;
        }

        var absorbed = new HashSet<Draft>(ReferenceEqualityComparer.Instance);
        // Hosts longest first, so that a piece joins the tachycardia it belongs to rather than another piece. Only the
        // drafts that start near a host are looked at: a piece is shorter than its host, so it starts at most the longer
        // of the sustained duration and the host's own duration (plus the gap) before it.
        foreach (var original in list.OrderByDescending(d => d.Last - d.First).ToList())
        {
            if (absorbed.Contains(original))
            {
                continue;
            }

            var host = current[original];
            var grew = true;
            while (grew)
            {
                grew = false;
                var from = Array.BinarySearch(startS, host.Episode.StartS - Math.Max(s.SustainedS, host.Episode.DurationS) - s.FragmentGapS);
                from = from < 0 ? ~from : from;
                for (var j = from; j < list.Count && startS[j] <= host.Episode.EndS + s.FragmentGapS; j++)
                {
                    var p = list[j];
                    if (ReferenceEquals(p, original) || absorbed.Contains(p))
                    {
                        continue;
                    }

                    var piece = current[p];
                    if (piece.Last - piece.First <= host.Last - host.First
                        && ((piece.Episode.DurationS < s.SustainedS && Related(host, piece)) || SameTachycardia(host, piece))
                        && Near(host, piece, t, s.FragmentGapS))
                    {
                        absorbed.Add(p);
                        host = Rebuild(host, Math.Min(host.First, piece.First), Math.Max(host.Last, piece.Last), t, settings);
                        current[original] = host;
                        grew = true;
                    }
                }
            }
        }

        var result = list.Where(d => !absorbed.Contains(d)).Select(d => current[d]).ToList();
        result.Sort((a, b) => a.First.CompareTo(b.First));
        return result;
    }

    private static bool Related(Draft host, Draft piece)
    {
        var kind = piece.Episode.Kind;
        var narrowPiece = piece.Episode.Width != QrsWidth.Broad;
        if (EpisodeKinds.IsSupraventricularEctopic(host.RawKind))
        {
            return narrowPiece && kind is EpisodeKinds.SveRun or EpisodeKinds.SinusTachycardia or EpisodeKinds.UnclassifiedTachycardia;
        }

        if (host.RawKind is EpisodeKinds.SinusTachycardia or EpisodeKinds.SinusWithPacs)
        {
            return narrowPiece && kind is EpisodeKinds.SinusTachycardia or EpisodeKinds.UnclassifiedTachycardia;
        }

        if (host.RawKind == EpisodeKinds.BroadTachycardia)
        {
            return kind == EpisodeKinds.VeRun || (piece.Episode.Width == QrsWidth.Broad && kind == EpisodeKinds.UnclassifiedTachycardia);
        }

        if (host.RawKind is EpisodeKinds.Af or EpisodeKinds.AfBrief)
        {
            // A narrow run of beats labelled S, or a slow narrow "ectopic rhythm", wholly inside AF is AF's own first or
            // irregular beats, labelled S before the rhythm was known to be AF (in AF, conducted beats are not
            // supraventricular ectopics). By the classifier's kind: under 30 s the one-kind rule calls a slow one an
            // SVE run as well.
            return narrowPiece && piece.RawKind is EpisodeKinds.SveRun or EpisodeKinds.JunctionalRhythm or EpisodeKinds.EctopicAtrialRhythm
                && piece.First >= host.First && piece.Last <= host.Last;
        }

        return false;
    }

    // Two pieces of one ectopic tachycardia kind (a flutter whose conduction changes for a few beats) are one.
    private static bool SameTachycardia(Draft host, Draft piece) =>
        host.RawKind == piece.RawKind && (EpisodeKinds.IsSupraventricularEctopic(host.RawKind) || host.RawKind == EpisodeKinds.BroadTachycardia);

    // Overlapping, or the gap between them at most gapS and analysable throughout.
    private static bool Near(Draft host, Draft piece, BeatTrack t, double gapS)
    {
        if (piece.First <= host.Last && host.First <= piece.Last)
        {
            return true;
        }

        var (from, to) = piece.First > host.Last ? (host.Last, piece.First) : (piece.Last, host.First);
        if (t.TimeS(to) - t.TimeS(from) > gapS)
        {
            return false;
        }

        for (var i = from + 1; i <= to; i++)
        {
            if (!t.HasRr(i))
            {
                return false;
            }
        }

        return true;
    }

    // The host over its new extent, measured again (nothing to do when the extent stands).
    private static Draft Rebuild(Draft host, int first, int last, BeatTrack t, AnalysisSettings settings) =>
        first == host.First && last == host.Last ? host : CandidateDescriber.Remeasured(host, first, last, t, settings);
}
