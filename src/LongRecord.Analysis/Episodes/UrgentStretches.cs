using LongRecord.Analysis.Rhythm;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// Urgent findings from the quality stage's verdicts, never only excluded as noise: continuous activity with no QRS on
/// every lead (<c>chaotic-all-leads</c>) is possible ventricular flutter or fibrillation (<c>vf</c>); a flat line on
/// every lead (<c>flat-all-leads</c>) is signal loss — possible asystole or lead-off (<c>signal-loss</c>). Stretches of
/// one reason closer than the merge gap are one finding. With a signal, a sharp spectral peak at 200–350/min tells
/// ventricular flutter (a regular, sine-like wave) from fibrillation.
/// </summary>
internal static class UrgentStretches
{
    public const string Chaotic = "chaotic-all-leads", Flat = "flat-all-leads";

    public static List<Episode> Find(IReadOnlyList<SignalStretch> stretches, BeatTrack t, IEpisodeSignal? signal, EpisodeSettings s)
    {
        var list = new List<Episode>();
        foreach (var reason in new[] { Chaotic, Flat })
        {
            var merged = new List<(double StartS, double EndS)>();
            foreach (var q in stretches.Where(q => q.Reason == reason).OrderBy(q => q.StartS))
            {
                if (merged.Count > 0 && q.StartS - merged[^1].EndS <= s.UrgentMergeS)
                {
                    merged[^1] = (merged[^1].StartS, Math.Max(merged[^1].EndS, q.EndS));
                }
                else
                {
                    merged.Add((q.StartS, q.EndS));
                }
            }

            foreach (var (startS, endS) in merged)
            {
                var before = t.LastAtOrBefore(startS);
                var after = t.FirstAtOrAfter(endS);
                var between = before >= 0 && after < t.Count;
                var vf = reason == Chaotic;
                var evidence = vf ? "continuous activity with no QRS on every lead" : "flat line on every lead: possible asystole or lead-off";
                if (vf && signal is not null)
                {
                    evidence += Describe(signal, startS, endS);
                }

                if (between)
                {
                    evidence += "; beats before and after";
                }

                list.Add(new Episode
                {
                    Kind = vf ? EpisodeKinds.Vf : EpisodeKinds.SignalLoss,
                    StartS = startS,
                    EndS = endS,
                    Beats = 0,
                    OnsetObserved = before >= 0,
                    OffsetObserved = after < t.Count,
                    Evidence = evidence,
                    Confidence = vf ? 0.7 : 0.8,
                    Urgent = true,
                });
            }
        }

        return list;
    }

    private static string Describe(IEpisodeSignal signal, double startS, double endS)
    {
        var w = SignalWindow.Read(signal, startS, Math.Min(endS, startS + 30));
        if (w is null)
        {
            return "";
        }

        var spectrum = new double[AtrialSpectrum.Bins];
        var keep = new bool[w.Count];
        for (var lead = 0; lead < w.Leads; lead++)
        {
            var x = w.Lead(lead);
            for (var i = 0; i < x.Length; i++)
            {
                keep[i] = !float.IsNaN(x[i]);
            }

            AtrialSpectrum.Accumulate(x, keep, w.RateHz, spectrum);
        }

        var (peakHz, share, _) = AtrialSpectrum.Describe(spectrum);
        if (double.IsNaN(peakHz))
        {
            return "";
        }

        return share >= 0.3 && peakHz * 60 is >= 200 and <= 350
            ? FormattableString.Invariant($"; regular sine-like wave at {60 * peakHz:0}/min: possible ventricular flutter")
            : FormattableString.Invariant($"; irregular activity (peak {60 * peakHz:0}/min, {100 * share:0} % of power): possible ventricular fibrillation");
    }
}
