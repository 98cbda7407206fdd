using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// Atrial activity of a candidate: P wave before each QRS (the beats stage's judgement), P shapes against the sinus P
/// of the beats before the episode and among themselves, and the atrial rate — from the spectrum of the
/// average-beat-cancelled signal in an irregular rhythm, from the locked-wave index in a regular one — with the RR
/// clustering at multiples of the flutter cycle. Also the width of the mean complex. Average-beat cancellation (Slocum,
/// Sahakian and Swiryn 1992, from memory) is not used: it absorbs atrial waves locked to the QRS.
/// </summary>
internal static class AtrialActivity
{
    private const double FlutterLowHz = 3.5, FlutterHighHz = 6.2;
    private const double LockedLowBpm = 200, LockedHighBpm = 380;
    private const double ClusterTolerance = 0.12;
    private const int MinClusterIntervals = 20;

    // Sinus beats before the episode needed to judge how often this recording shows its P waves (our choice).
    private const int MinSinusJudged = 10;

    // Below this share of P waves found, the beats before an episode are not taken for sinus beats (our choice).
    private const double MinSinusReferenceShare = 0.5;

    public static AtrialFinding Measure(IReadOnlyList<SignalWindow> windows, BeatTrack t, int first, int last, RrRegularity regularity, EpisodeSettings s)
    {
        var pShare = PBeforeShare(t, first, last);
        var episode = new List<float[]>();
        var sinus = new List<float[]>();
        var fastRr = 60.0 / s.TachycardiaRateBpm;
        int sinusJudged = 0, sinusWithP = 0;
        foreach (var w in windows)
        {
            for (var i = Math.Max(0, t.FirstAtOrAfter(w.StartSample / t.RateHz)); i < t.Count && t[i].Sample < w.EndSample; i++)
            {
                var inside = i > first && i <= last;
                var sinusLike = i < first && t[i].Class == BeatClass.N && t.HasRr(i) && t.RrS[i] >= fastRr;
                if (!inside && !sinusLike)
                {
                    continue;
                }

                if (sinusLike && t[i].PWave >= 0)
                {
                    sinusJudged++;
                    sinusWithP += t[i].PWave == 1 ? 1 : 0;
                }

                var v = PWaveShapes.Vector(w, t[i]);
                if (v is not null)
                {
                    (inside ? episode : sinus).Add(v);
                }
            }
        }

        var sinusShare = sinusJudged >= MinSinusJudged ? (double)sinusWithP / sinusJudged : double.NaN;
        var pFound = PFoundFactor(sinusShare, s);
        var episodeMean = PWaveShapes.Mean(episode);
        var sinusMean = sinus.Count >= 3 ? PWaveShapes.Mean(sinus) : null;
        var sinusCorrelation = episodeMean is not null && sinusMean is not null && episode.Count >= 3
            ? PWaveShapes.Similarity(episodeMean, sinusMean) : double.NaN;
        var dominant = double.NaN;
        var shapes = episode.Count >= 3 ? PWaveShapes.Count(episode, s.SinusPCorrelation, 0.1, out dominant) : 0;

        var width = double.NaN;
        foreach (var w in windows)
        {
            width = MeanComplexWidth.Measure(w, t, first, last);
            if (!double.IsNaN(width))
            {
                break;
            }
        }

        var irregular = regularity.SuccessiveChange > s.IrregularRrChange;
        double atrialBpm = double.NaN, peakShare = double.NaN, bandShare = double.NaN, locked = double.NaN, cluster = double.NaN;
        string finding;
        var ventricularBpm = 60.0 / OnsetOffset.MedianRr(t, first + 1, last);
        if (!irregular)
        {
            // The n:1 hypothesis whose atrial rate lies in the flutter range.
            for (var n = 2; n <= 4; n++)
            {
                if (n * ventricularBpm < LockedLowBpm || n * ventricularBpm > LockedHighBpm)
                {
                    continue;
                }

                foreach (var w in windows)
                {
                    var index = LockedAtrialWaves.Index(w, t, first, last, 60.0 / ventricularBpm, n, fastRr);
                    if (!double.IsNaN(index) && (double.IsNaN(locked) || index > locked))
                    {
                        locked = index;
                        atrialBpm = n * ventricularBpm;
                    }
                }
            }

            finding = locked >= s.LockedWaveIndex ? "flutter-waves-locked" : PFinding(pShare, pFound, s);
            if (finding != "flutter-waves-locked")
            {
                atrialBpm = double.NaN;
            }
        }
        else
        {
            var spectrum = new double[AtrialSpectrum.Bins];
            var any = false;
            foreach (var w in windows)
            {
                var part = AtrialSpectrum.Tq(w, t, first, last);
                if (part is not null)
                {
                    any = true;
                    for (var b = 0; b < spectrum.Length; b++)
                    {
                        spectrum[b] += part[b];
                    }
                }
            }

            if (any)
            {
                var (peakHz, share, band) = AtrialSpectrum.Describe(spectrum);
                peakShare = share;
                bandShare = band;
                // A peak in the flutter range that is sharp, or that the RR intervals fall at whole multiples of (in
                // noise the peak's share of the band drops; the clustering of 20 or more RR does not happen by chance).
                if (peakHz >= FlutterLowHz && peakHz <= FlutterHighHz && (share >= s.FlutterPeakShare || regularity.Intervals >= MinClusterIntervals))
                {
                    var (clusterShare, cycle) = RrRegularity.ClusterAtMultiples(t, first, last, 1 / peakHz, ClusterTolerance);
                    cluster = clusterShare;
                    atrialBpm = 60 / cycle;
                }
                else
                {
                    atrialBpm = 60 * peakHz;
                }
            }

            finding = cluster >= s.FlutterClusterShare ? "flutter-waves"
                : pShare < s.PBeforeQrsShare && bandShare >= 0.5 ? "fibrillatory-waves"
                : PFinding(pShare, pFound, s);
        }

        return new AtrialFinding
        {
            Finding = finding,
            PBeforeShare = pShare,
            PFoundFactor = pFound,
            SinusPShare = sinusShare,
            PShapes = shapes,
            DominantPShare = dominant,
            SinusPCorrelation = sinusCorrelation,
            AtrialRateBpm = atrialBpm,
            PeakShare = peakShare,
            BandShare = bandShare,
            LockedWaveIndex = locked,
            ClusterShare = cluster,
            MeanComplexQrsMs = width,
        };
    }

    /// <summary>Share of the beats (its first left out) with a P wave in the PR window, among those judged; NaN when none was judged.</summary>
    public static double PBeforeShare(BeatTrack t, int first, int last)
    {
        int judged = 0, with = 0;
        for (var i = first + 1; i <= last; i++)
        {
            if (t[i].PWave >= 0)
            {
                judged++;
                with += t[i].PWave == 1 ? 1 : 0;
            }
        }

        return judged > 0 ? (double)with / judged : double.NaN;
    }

    /// <summary>
    /// How often this recording's beat-by-beat search finds a P wave where one stands, against clean sinus beats: the
    /// share of the sinus beats before the episode with a P found over the settings' clean share, at most 1. Every
    /// P-wave share test scales its threshold by it (noise hides P waves inside an episode as much as before it). 1
    /// when too few sinus beats were judged (NaN) or under half of them show a P wave: a sinus rhythm shows its P in
    /// most beats even in noise, so such beats are no sinus reference (AF or flutter before the episode, as in MITDB 202).
    /// </summary>
    public static double PFoundFactor(double sinusShare, EpisodeSettings s) =>
        sinusShare >= MinSinusReferenceShare ? Math.Min(1, sinusShare / s.SinusPFoundShare) : 1;

    private static string PFinding(double pShare, double pFound, EpisodeSettings s) =>
        double.IsNaN(pShare) ? "unclear" : pShare >= pFound * s.PBeforeQrsShare ? "p-waves" : pShare <= s.PAbsentShare ? "p-after-qrs" : "unclear";
}
