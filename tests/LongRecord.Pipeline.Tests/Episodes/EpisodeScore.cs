using System.Globalization;
using LongRecord.Analysis.Episodes;
using LongRecord.Synthesis.Truth;

namespace LongRecord.Pipeline.Tests.Episodes;

/// <summary>
/// Episode-by-episode scoring against scripted truth (the issue's protocol): a true episode is found when a detected
/// episode of the same kind overlaps it (the one overlapping most is its match); sensitivity counts true episodes of at
/// least 10 beats and the signal stretches (vf, signal-loss); a detected episode is a true positive when it overlaps a
/// true episode of its kind; the kind is correct when the detected episode overlapping the true one most has its kind;
/// onset and offset within 2 s and the onset type (abrupt or gradual) are judged on the match.
/// </summary>
public sealed class EpisodeScore
{
    private const double TimeToleranceS = 2.0;

    public int Truth { get; private set; }
    public int Found { get; private set; }
    public int Detected { get; private set; }
    public int TruePositive { get; private set; }
    public int KindJudged { get; private set; }
    public int KindCorrect { get; private set; }
    public int Timed { get; private set; }
    public int TimedWithin { get; private set; }
    public int OnsetJudged { get; private set; }
    public int OnsetCorrect { get; private set; }
    public List<string> Misses { get; } = [];

    public double Sensitivity => Ratio(Found, Truth);
    public double PositivePredictivity => Ratio(TruePositive, Detected);
    public double KindAccuracy => Ratio(KindCorrect, KindJudged);
    public double TimingShare => Ratio(Timed == 0 ? 0 : TimedWithin, Timed);
    public double OnsetAccuracy => Ratio(OnsetCorrect, OnsetJudged);

    public void Add(string label, IReadOnlyList<TruthEpisode> truth, IReadOnlyList<Episode> detected)
    {
        foreach (var t in truth)
        {
            if (t.Beats < 10 && t.Kind is not (EpisodeKinds.Vf or EpisodeKinds.SignalLoss))
            {
                continue;
            }

            Truth++;
            KindJudged++;
            var any = detected.Where(d => Overlap(d, t) > 0).OrderByDescending(d => Overlap(d, t)).FirstOrDefault();
            if (any?.Kind == t.Kind)
            {
                KindCorrect++;
            }
            else
            {
                Misses.Add(Invariant($"{label}: {t.Kind} {t.StartS:0.0}-{t.EndS:0.0} s taken as {any?.Kind ?? "nothing"}"));
            }

            var match = detected.Where(d => d.Kind == t.Kind && Overlap(d, t) > 0).OrderByDescending(d => Overlap(d, t)).FirstOrDefault();
            if (match is null)
            {
                continue;
            }

            Found++;
            Timed++;
            if (Math.Abs(match.StartS - t.StartS) <= TimeToleranceS && Math.Abs(match.EndS - t.EndS) <= TimeToleranceS)
            {
                TimedWithin++;
            }
            else
            {
                Misses.Add(Invariant($"{label}: {t.Kind} {t.StartS:0.0}-{t.EndS:0.0} s found at {match.StartS:0.0}-{match.EndS:0.0} s"));
            }

            if (match.Onset is { Type: "abrupt" or "gradual" } onset && t.Kind is not (EpisodeKinds.Vf or EpisodeKinds.SignalLoss
                or EpisodeKinds.VentricularBigeminy or EpisodeKinds.VentricularTrigeminy or EpisodeKinds.AtrialBigeminy))
            {
                OnsetJudged++;
                var expected = t.Onset == OnsetType.Abrupt ? "abrupt" : "gradual";
                if (onset.Type == expected)
                {
                    OnsetCorrect++;
                }
                else
                {
                    Misses.Add(Invariant($"{label}: {t.Kind} onset {onset.Type} (ratio {onset.Ratio:0.00}), truth {expected}"));
                }
            }
        }

        foreach (var d in detected)
        {
            Detected++;
            if (truth.Any(t => t.Kind == d.Kind && Overlap(d, t) > 0))
            {
                TruePositive++;
            }
            else
            {
                Misses.Add(Invariant($"{label}: false {d.Kind} {d.StartS:0.0}-{d.EndS:0.0} s ({d.Evidence})"));
            }
        }
    }

    public string Summary(string label) => Invariant(
        $"{label}: episode Se {100 * Sensitivity:F1} % ({Found}/{Truth}), +P {100 * PositivePredictivity:F1} % ({TruePositive}/{Detected}), onset and offset within 2 s {100 * TimingShare:F1} % ({TimedWithin}/{Timed}), kind {100 * KindAccuracy:F1} % ({KindCorrect}/{KindJudged}), onset type {100 * OnsetAccuracy:F1} % ({OnsetCorrect}/{OnsetJudged})");

    // A zero-length true episode (an instant) overlaps what contains it.
    private static double Overlap(Episode d, TruthEpisode t) =>
        Math.Min(d.EndS, t.EndS) - Math.Max(d.StartS, t.StartS) >= 0 ? Math.Max(1e-6, Math.Min(d.EndS, t.EndS) - Math.Max(d.StartS, t.StartS)) : 0;

    private static double Ratio(int a, int b) => b == 0 ? double.NaN : (double)a / b;

    private static string Invariant(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
