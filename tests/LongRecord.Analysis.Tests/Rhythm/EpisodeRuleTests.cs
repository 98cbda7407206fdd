using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Rhythm;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Tests.Rhythm;

/// <summary>
/// Pauses, bradycardia, windows and rows on hand-made beat lists, against the rules as the issue states them
/// (pause ≥ 2.0 s reported, ≥ 3.0 s highlighted; bradycardia below 50 bpm for at least 1 min — common practice, no
/// source; AF episode ≥ 30 s — HRS/EHRA/ECAS 2017).
/// </summary>
public sealed class EpisodeRuleTests
{
    private static RhythmResult Run(Beat[] beats, AnalysisSettings? s = null, IReadOnlyList<long>? nonConducted = null, DateTime? start = null) =>
        RhythmAnalyser.Analyse(new RhythmInput
        {
            Beats = beats,
            ReferenceRateHz = 1000,
            DurationS = SyntheticBeats.EndS(beats),
            NonConductedPSamples = nonConducted ?? [],
            StartDateTime = start,
        }, s);

    [Fact]
    public void Pauses_ReportedHighlightedAndToldApart()
    {
        var rr = Enumerable.Repeat(0.8, 20).ToList();
        rr.Add(2.4);                                   // sinus pause, 2.4 s: reported, not highlighted
        rr.AddRange(Enumerable.Repeat(0.8, 20));
        rr.AddRange([0.5, 3.1]);                       // premature beat then a 3.1 s pause: highlighted, after premature
        rr.AddRange(Enumerable.Repeat(0.8, 20));
        rr.Add(1.99);                                  // just under 2.0 s: not a pause
        rr.AddRange(Enumerable.Repeat(0.8, 20));
        var beats = SyntheticBeats.FromRr(rr);
        var secondPauseStart = beats[20].Sample;
        var result = Run(beats, nonConducted: [secondPauseStart + 1000]);
        var pauses = result.Episodes.Where(e => e.Kind == "pause").ToList();
        Assert.Equal(2, pauses.Count);
        Assert.Equal(2.4, pauses[0].DurationS, 3);
        Assert.False(pauses[0].Highlighted);
        Assert.Equal(PauseContext.None, pauses[0].Context);
        Assert.True(pauses[0].PossibleAvBlock);        // a P with no QRS inside it
        Assert.Equal(3.1, pauses[1].DurationS, 3);
        Assert.True(pauses[1].Highlighted);
        Assert.Equal(PauseContext.AfterPremature, pauses[1].Context);
        Assert.False(pauses[1].PossibleAvBlock);
        Assert.Equal(2, result.Summary.PauseCount);
        Assert.Equal(1, result.Summary.HighlightedPauseCount);
    }

    [Fact]
    public void Bradycardia_BelowFiftyForAMinute_IsAnEpisode_ShorterIsNot()
    {
        var rr = new List<double>();
        rr.AddRange(Enumerable.Repeat(0.8, 60));       // 75 bpm
        rr.AddRange(Enumerable.Repeat(1.35, 50));      // 44 bpm for 67.5 s
        rr.AddRange(Enumerable.Repeat(0.8, 60));
        rr.AddRange(Enumerable.Repeat(1.35, 30));      // 44 bpm for 40.5 s: too short
        rr.AddRange(Enumerable.Repeat(0.8, 60));
        var result = Run(SyntheticBeats.FromRr(rr));
        var brady = Assert.Single(result.Episodes, e => e.Kind == "bradycardia");
        Assert.Equal(60.0 / 1.35, brady.MeanBpm, 6);
        Assert.Equal(50 * 1.35, brady.DurationS, 3);
        Assert.Equal(51, brady.Beats);
    }

    [Fact]
    public void ShortIrregularStretch_IsAfBrief_LongOneIsAf_AndOnlyAfCountsInTheBurden()
    {
        var rng = new Random(7);
        double Irregular() => 0.45 + 0.5 * rng.NextDouble();   // RR 0.45–0.95 s, independent: fibrillation-like
        var rr = new List<double>();
        rr.AddRange(Enumerable.Repeat(0.8, 100));
        for (var t = 0.0; t < 20;)
        {
            var x = Irregular();
            rr.Add(x);
            t += x;
        }

        rr.AddRange(Enumerable.Repeat(0.8, 100));
        for (var t = 0.0; t < 120;)
        {
            var x = Irregular();
            rr.Add(x);
            t += x;
        }

        rr.AddRange(Enumerable.Repeat(0.8, 100));
        var result = Run(SyntheticBeats.FromRr(rr));
        var af = Assert.Single(result.Episodes, e => e.Kind == "af");
        Assert.InRange(af.DurationS, 110, 130);
        Assert.True(af.OnsetObserved && af.OffsetObserved);
        Assert.Contains(result.Episodes, e => e.Kind == "af-brief");
        Assert.Equal(100 * af.DurationS / result.Summary.AnalysableS, result.Summary.AfBurdenPercent, 6);
    }

    [Fact]
    public void Bigeminy_IsNotAf()
    {
        // Ventricular bigeminy: N–V coupling 0.5 s, compensatory 1.1 s, for 5 min (classes unlabelled: RR rules only).
        var rr = new List<double>();
        for (var i = 0; i < 300; i++)
        {
            rr.Add(i % 2 == 0 ? 0.5 : 1.1);
        }

        var result = Run(SyntheticBeats.FromRr(rr));
        Assert.DoesNotContain(result.Episodes, e => e.Kind is "af" or "af-brief");
    }

    [Fact]
    public void TrendRows_FollowTheClock_AndMarkThinWindows()
    {
        // Start 09:40: rows 09:40–10:00, 10:00–11:00, 11:00–…; beats for 1 h 40 min, then nothing for 1 h.
        var rr = Enumerable.Repeat(1.0, 6000).ToList();
        var beats = SyntheticBeats.FromRr(rr, firstS: 0);
        var result = RhythmAnalyser.Analyse(new RhythmInput
        {
            Beats = beats,
            ReferenceRateHz = 1000,
            DurationS = 6000 + 3600,
            StartDateTime = new DateTime(2026, 3, 11, 9, 40, 0),
        });
        Assert.Equal(4, result.Trend.Count);
        Assert.Equal(new DateTime(2026, 3, 11, 9, 40, 0), result.Trend[0].ClockStart);
        Assert.Equal(new DateTime(2026, 3, 11, 10, 0, 0), result.Trend[1].ClockStart);
        Assert.Equal(1200, result.Trend[0].EndS, 9);
        Assert.Equal(20, result.Trend[0].AnalysableMinutes, 6);
        Assert.Equal(60, result.Trend[0].MeanBpm, 6);
        Assert.True(result.Trend[1].Sufficient);
        Assert.Equal(0, result.Trend[3].AnalysableMinutes, 6);
        Assert.False(result.Trend[3].Sufficient);
        Assert.True(double.IsNaN(result.Trend[3].MeanBpm));
    }

    [Fact]
    public void Rows_EpisodeColumnsBeginAsSpecified_AndSummaryHasTheRequiredKeys()
    {
        Assert.Equal("id,kind,start_s,end_s,duration_s,beats,mean_bpm,max_bpm", string.Join(",", RhythmRows.EpisodeColumns.Take(8)));
        var rr = Enumerable.Repeat(0.8, 50).Append(2.5).Concat(Enumerable.Repeat(0.8, 50)).ToList();
        var result = Run(SyntheticBeats.FromRr(rr));
        var row = Assert.Single(RhythmRows.Episodes(result));
        Assert.Equal("1", row[0]);
        Assert.Equal("pause", row[1]);
        Assert.Equal("2.500", row[4]);
        var keys = RhythmRows.Summary(result).Select(kv => kv.Key).ToList();
        foreach (var k in new[] { "total_beats", "analysable_percent", "hr_min_bpm", "hr_mean_bpm", "hr_max_bpm", "af_burden_percent", "pause_count" })
        {
            Assert.Contains(k, keys);
        }

        Assert.Equal(rr.Count + 1, RhythmRows.Summary(result).First(kv => kv.Key == "total_beats").Value);
    }

    [Theory]
    [InlineData(4.0, 1)]    // 4 s of noise inside AF: one episode across it
    [InlineData(25.0, 2)]   // 25 s of noise: longer than the 10 s bridged, two episodes
    public void ShortUnanalysableStretchInsideAf_DoesNotSplitIt_NorCountsAsAf(double noiseS, int episodes)
    {
        // Fibrillation (independent RR draws, uniform 0.45–1.15 s: a synthetic stand-in, common practice, no source)
        // for 120 s, noise with no beats for noiseS, fibrillation for 120 s more; sinus (1.0 s) before and after.
        var random = new Random(11);
        var rr = new List<double>(Enumerable.Repeat(1.0, 60));
        void Fibrillate()
        {
            for (var t = 0.0; t < 120; t += rr[^1])
            {
                rr.Add(0.45 + 0.7 * random.NextDouble());
            }
        }

        Fibrillate();
        var noiseStartS = 1.0 + rr.Sum();
        rr.Add(noiseS);                                 // the interval across the noise: its two beats on either side
        var noiseEndS = 1.0 + rr.Sum();
        Fibrillate();
        rr.AddRange(Enumerable.Repeat(1.0, 60));
        var beats = SyntheticBeats.FromRr(rr);
        var endS = SyntheticBeats.EndS(beats);
        var result = RhythmAnalyser.Analyse(new RhythmInput
        {
            Beats = beats,
            ReferenceRateHz = 1000,
            DurationS = endS,
            Stretches = [new SignalStretch(0, noiseStartS + 0.1, true), new SignalStretch(noiseStartS + 0.1, noiseEndS - 0.1, false, "noise"), new SignalStretch(noiseEndS - 0.1, endS, true)],
        });

        var af = result.Episodes.Where(e => e.Kind == RhythmEpisode.AfKind).ToList();
        Assert.True(episodes == af.Count, string.Join(", ", result.Episodes.Select(e => $"{e.Kind} {e.StartS:F1}-{e.EndS:F1}")) + $" noise {noiseStartS:F1}-{noiseEndS:F1}");
        Assert.Contains(af, e => e.StartS < noiseStartS && e.EndS > (episodes == 1 ? noiseEndS : noiseStartS - 60));
        // The noise is no AF time: the burden's AF seconds stay within the fibrillation itself (2 × 120 s, less the
        // detector's edges).
        Assert.True(result.Summary.AfS <= 240 + 2, $"AF {result.Summary.AfS:F1} s");
    }

    [Fact]
    public void UnanalysableStretch_IsLeftOutOfTheTime()
    {
        var rr = Enumerable.Repeat(1.0, 600).ToList();
        var beats = SyntheticBeats.FromRr(rr, firstS: 0);
        var result = RhythmAnalyser.Analyse(new RhythmInput
        {
            Beats = beats,
            ReferenceRateHz = 1000,
            DurationS = 600,
            Stretches = [new SignalStretch(0, 200, true), new SignalStretch(200, 300, false, "noise"), new SignalStretch(300, 600, true)],
        });
        // Intervals whose two beats lie in one analysable stretch (half-open [start, end)): beats 0…199 s and 300…599 s.
        Assert.Equal(199 + 299, result.Summary.AnalysableS, 6);
    }
}
