using LongRecord.Synthesis.Truth;
using LongRecord.TestSupport;

namespace LongRecord.Synthesis.Tests;

/// <summary>Truth file and annotation list: complete, ordered, and in the MIT-BIH conventions named in the issue.</summary>
public sealed class TruthExportTests
{
    [Fact]
    public void TruthDocument_RoundTripsThroughJson()
    {
        var rec = ScenarioFiles.Recording("pauses-and-av-block");
        using var folder = new TempFolder("truth");
        var path = folder.Path("truth.json");
        TruthDocument.From(rec).Save(path);
        var back = TruthDocument.Load(path);
        Assert.Equal(rec.Truth.Beats.ToArray(), back.Beats);
        Assert.Equal(rec.Truth.PWaves, back.PWaves);
        Assert.Equal(rec.Truth.Rhythms.Select(r => (r.Kind, r.StartS, r.EndS, r.BeatCount)), back.Rhythms.Select(r => (r.Kind, r.StartS, r.EndS, r.BeatCount)));
        Assert.False(File.Exists(path + ".partial"));
        Assert.Contains("\"qrsOnsetS\"", File.ReadAllText(path));
    }

    [Fact]
    public void Annotations_CarryBeatsRhythmChangesAndBlockedP()
    {
        var rec = ScenarioFiles.Recording("pauses-and-av-block");
        var annotations = rec.Truth.Annotations().ToList();
        Assert.Equal(annotations.OrderBy(a => a.Sample).Select(a => a.Sample), annotations.Select(a => a.Sample));
        Assert.Equal(rec.Truth.Beats.Count, annotations.Count(a => a.Code is "N" or "A" or "S" or "V"));
        Assert.Equal(rec.Truth.PWaves.Count(p => p.IsNonConducted), annotations.Count(a => a.Code == "x"));
        Assert.Equal(["(N", "(SBR", "(BII", "(N"], annotations.Where(a => a.Code == "+").Select(a => a.Aux!));

        // 3:2 block: every third P wave has no QRS, so the block segment holds twice as many beats as blocked P waves.
        var block = SignalProbe.Segment(rec, "av-block-2");
        var blocked = rec.Truth.PWaves.Count(p => p.IsNonConducted && p.PeakS > block.StartS && p.PeakS < block.EndS);
        Assert.InRange(block.BeatCount, 2 * blocked - 2, 2 * blocked + 2);
        Assert.Equal(2, rec.Truth.Rhythms.Count(r => r.Kind == "pause"));
        Assert.Contains(rec.Truth.Rhythms, r => r.Kind == "pause" && Math.Abs(r.DurationS - 3.2) < 1e-9);
    }

    [Fact]
    public void VentricularFlutterAndFibrillation_HaveNoBeatsAndAreBracketed()
    {
        var rec = ScenarioFiles.Recording("vf-vfl");
        var annotations = rec.Truth.Annotations().ToList();
        foreach (var kind in new[] { "ventricular-flutter", "ventricular-fibrillation" })
        {
            var interval = SignalProbe.Segment(rec, kind);
            Assert.DoesNotContain(rec.Truth.Beats, b => b.RTimeS >= interval.StartS && b.RTimeS <= interval.EndS);
            Assert.Contains(annotations, a => a.Code == "[" && a.Sample == interval.StartSample);
            Assert.Contains(annotations, a => a.Code == "]" && a.Sample == interval.EndSample);

            // The rendered signal inside is large and never still: no flat stretch of 100 ms (our criterion).
            var signal = SignalProbe.Render(rec, interval.StartSample, (int)(interval.EndSample - interval.StartSample), SignalComponents.Ecg)[0];
            Assert.True(signal.Max() - signal.Min() > 1.0, $"{kind} peak-to-peak {signal.Max() - signal.Min():0.00} mV");
        }

        Assert.Equal(["(N", "(VFL", "(N", "(VF", "(N"], annotations.Where(a => a.Code == "+").Select(a => a.Aux!));
    }

    [Fact]
    public void Annotations_MarkNoiseChangesWithLeadMasks()
    {
        var rec = ScenarioFiles.Recording("noise-motion");
        var marks = rec.Truth.Annotations().Where(a => a.Code == "~").ToList();
        Assert.Equal(6, marks.Count);
        Assert.Equal([3, 0, 1, 0, 3, 0], marks.Select(m => m.NoisyLeadMask));
        Assert.Equal("electrode-motion", marks[0].Aux);
    }

    [Fact]
    public void Beats_CarryTheirClassesPAndEpisodes()
    {
        var psvt = ScenarioFiles.Recording("psvt-180");
        var episode = SignalProbe.Segment(psvt, "psvt");
        var inside = psvt.Truth.Beats.Where(b => b.RTimeS >= episode.StartS && b.RTimeS <= episode.EndS).ToList();
        Assert.Equal(PWaveKind.Ectopic, inside[0].PWave);
        Assert.All(inside.Skip(1), b => Assert.Equal(PWaveKind.Retrograde, b.PWave));
        Assert.All(inside, b => Assert.Equal(BeatClass.S, b.Class));
        Assert.Equal(OnsetType.Abrupt, episode.Onset);
        var after = psvt.Truth.Beats.First(b => b.RTimeS > episode.EndS);
        Assert.True(after.RTimeS - episode.EndS >= 1.5, $"pause after PSVT {after.RTimeS - episode.EndS:0.00} s");

        var ve = ScenarioFiles.Recording("ve-runs");
        Assert.Equal(2, ve.Truth.Rhythms.Count(r => r.Kind == "ve-couplet"));
        Assert.Equal([3.0, 6.0], ve.Truth.Rhythms.Where(r => r.Kind == "ve-run").Select(r => r.Parameters["beats"]));
        Assert.All(ve.Truth.Beats.Where(b => b.Class == BeatClass.V), b => Assert.Equal(PWaveKind.None, b.PWave));

        // Full compensatory pause after an isolated PVC: the sinus beats around it are two sinus cycles apart (±8 %, the
        // cycle's own variability; our tolerance).
        var beats = ve.Truth.Beats;
        foreach (var v in beats.Where(b => b.Class == BeatClass.V && b.Index > 1 && beats[b.Index - 1].Class == BeatClass.N && b.Index + 1 < beats.Count && beats[b.Index + 1].Class == BeatClass.N))
        {
            var around = beats[v.Index + 1].RTimeS - beats[v.Index - 1].RTimeS;
            var cycle = beats[v.Index - 1].RrS!.Value;
            Assert.InRange(around, 2 * cycle * 0.92, 2 * cycle * 1.08);
        }

        // Non-compensatory pause after a PAC: the sinus beats around it are less than two cycles apart (below 1.95
        // cycles, leaving the cycle's own variability; our tolerance).
        var pacs = ScenarioFiles.Recording("sinus-with-pacs");
        var pb = pacs.Truth.Beats;
        foreach (var s in pb.Where(b => b.Class == BeatClass.S && b.Index > 1 && b.Index + 1 < pb.Count))
        {
            var around = pb[s.Index + 1].RTimeS - pb[s.Index - 1].RTimeS;
            Assert.True(around < 1.95 * pb[s.Index - 1].RrS!.Value, $"PAC at {s.RTimeS:0.00} s: {around:0.000} s around, cycle {pb[s.Index - 1].RrS:0.000} s");
            Assert.Equal(PWaveKind.Ectopic, s.PWave);
        }
    }
}
