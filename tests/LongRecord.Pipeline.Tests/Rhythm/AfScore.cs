using System.Globalization;
using LongRecord.Analysis.Rhythm;
using LongRecord.Formats.Wfdb;

namespace LongRecord.Pipeline.Tests.Rhythm;

/// <summary>
/// Duration scoring of AF episodes in the manner of ANSI/AAMI EC57 (episode comparison, §3.2 and §4.3.3, from
/// memory): reference AF is the time from each (AFIB rhythm annotation to the next rhythm annotation; only scorable
/// time counts (after the first rhythm annotation, and no gap over 10 s between consecutive input beats); reference
/// atrial flutter (AFL) is left out of every figure.
/// </summary>
public sealed record AfScore(string Record, double ScorableS, double ReferenceAfS, double OurAfS, double OverlapS, double NonAfS, double TrueNegativeS)
{
    public double Sensitivity => OverlapS / ReferenceAfS;
    public double PositivePredictivity => OverlapS / OurAfS;
    public double Specificity => TrueNegativeS / NonAfS;
    public double ReferenceBurden => ReferenceAfS / ScorableS;
    public double OurBurden => OurAfS / ScorableS;

    public static AfScore Score(string record, IReadOnlyList<WfdbAnnotation> reference, double fs, IReadOnlyList<double> beatTimesS, IEnumerable<RhythmEpisode> episodes)
    {
        var rhythm = reference.Where(a => a.RhythmText is not null).OrderBy(a => a.Sample).ToList();
        var lastBeat = beatTimesS[^1];
        var refAf = new List<(double, double)>();
        var refAfl = new List<(double, double)>();
        for (var i = 0; i < rhythm.Count; i++)
        {
            var a = rhythm[i].Sample / fs;
            var b = i + 1 < rhythm.Count ? rhythm[i + 1].Sample / fs : lastBeat;
            var text = rhythm[i].RhythmText!.TrimEnd('\0').Trim();
            if (text == "(AFIB")
            {
                refAf.Add((a, b));
            }
            else if (text == "(AFL")
            {
                refAfl.Add((a, b));
            }
        }

        var covered = new List<(double, double)>();
        for (var i = 1; i < beatTimesS.Count; i++)
        {
            if (beatTimesS[i] - beatTimesS[i - 1] <= 10.0)
            {
                covered.Add((beatTimesS[i - 1], beatTimesS[i]));
            }
        }

        var firstRhythm = rhythm.Count > 0 ? rhythm[0].Sample / fs : double.PositiveInfinity;
        var scorable = TimeSet.Of(covered).Intersect(TimeSet.Of([(firstRhythm, double.PositiveInfinity)])).Subtract(TimeSet.Of(refAfl));
        var refSet = TimeSet.Of(refAf).Intersect(scorable);
        var ours = TimeSet.Of(episodes.Where(e => e.Kind == RhythmEpisode.AfKind).Select(e => (e.StartS, e.EndS))).Intersect(scorable);
        var nonAf = scorable.Subtract(refSet);
        return new AfScore(record, scorable.Length, refSet.Length, ours.Length, refSet.Intersect(ours).Length, nonAf.Length, nonAf.Subtract(ours).Length);
    }

    public static AfScore Pool(IEnumerable<AfScore> scores)
    {
        var list = scores.ToList();
        return new AfScore("pooled", list.Sum(s => s.ScorableS), list.Sum(s => s.ReferenceAfS), list.Sum(s => s.OurAfS), list.Sum(s => s.OverlapS), list.Sum(s => s.NonAfS), list.Sum(s => s.TrueNegativeS));
    }

    public override string ToString() => string.Create(CultureInfo.InvariantCulture,
        $"{Record,-8} scorable {ScorableS / 3600,6:F2} h  ref AF {ReferenceAfS / 3600,6:F2} h  ours {OurAfS / 3600,6:F2} h  Se {100 * Sensitivity,6:F2}  +P {100 * PositivePredictivity,6:F2}  Sp {100 * Specificity,6:F2}  burden ref {100 * ReferenceBurden,6:F2} ours {100 * OurBurden,6:F2}");
}
