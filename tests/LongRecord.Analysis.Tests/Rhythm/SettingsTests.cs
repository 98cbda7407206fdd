using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Tests.Rhythm;

/// <summary>The settings object: defaults as documented in the issue, JSON loading, every problem reported at once.</summary>
public sealed class SettingsTests
{
    [Fact]
    public void Defaults_AreTheIssueValues()
    {
        var s = AnalysisSettings.Default;
        Assert.Equal(100, s.Episodes.TachycardiaRateBpm);
        Assert.Equal(2.0, s.Pauses.ReportS);
        Assert.Equal(3.0, s.Pauses.HighlightS);
        Assert.Equal(30, s.Af.MinEpisodeS); // HRS/EHRA/ECAS 2017 expert consensus
        Assert.Equal(3, s.Episodes.RunMinimumBeats);
        Assert.Equal(50, s.Bradycardia.RateBpm);
        Assert.Equal(60, s.Bradycardia.MinDurationS);
        Assert.Equal(3600, s.Rhythm.TrendWindowS);
        Assert.Equal(300, s.Hrv.SegmentS); // Task Force 1996: 5 min
        Assert.Equal(1.0 / 128, s.Hrv.TriangularBinS); // Task Force 1996
        Assert.Equal((0.04, 0.15, 0.4), (s.Hrv.LfLowHz, s.Hrv.LfHighHz, s.Hrv.HfHighHz));
        Assert.Equal((2, 0.2), (s.Irregularity.SampleEntropyM, s.Irregularity.SampleEntropyR)); // Richman & Moorman 2000
        Assert.Empty(s.Problems());
    }

    [Fact]
    public void Load_PartialJson_KeepsDefaultsForMissingKeys()
    {
        var s = AnalysisSettings.Load("""
            // comments and trailing commas are allowed
            { "pauses": { "reportS": 2.5, "highlightS": 4 }, "af": { "minEpisodeS": 60, }, }
            """);
        Assert.Equal(2.5, s.Pauses.ReportS);
        Assert.Equal(4, s.Pauses.HighlightS);
        Assert.Equal(60, s.Af.MinEpisodeS);
        Assert.Equal(AnalysisSettings.Default.Rhythm, s.Rhythm);
        Assert.Equal(AnalysisSettings.Default.Hrv, s.Hrv);
    }

    [Fact]
    public void Load_ReportsEveryProblemAtOnce()
    {
        var e = Assert.Throws<AnalysisSettingsException>(() => AnalysisSettings.Load("""
            { "pauses": { "reportS": "two", "highlightS": 1.5, "typo": 1 },
              "rhythm": { "rateAveragingBeats": 2.5, "alignToClock": 1 },
              "bradycardia": { "rateBpm": 500 },
              "nonsense": {} }
            """, "my-settings.json"));
        Assert.Contains("pauses.reportS: must be a number", e.Problems);
        Assert.Contains("pauses.typo: is not a known setting", e.Problems);
        Assert.Contains("rhythm.rateAveragingBeats: must be a whole number (is 2.5)", e.Problems);
        Assert.Contains("rhythm.alignToClock: must be true or false", e.Problems);
        Assert.Contains("bradycardia.rateBpm: must be between 20 and 80 (is 500)", e.Problems);
        Assert.Contains(e.Problems, p => p.StartsWith("nonsense: is not a known settings section", StringComparison.Ordinal));
        Assert.Contains("pauses.highlightS: must be at least pauses.reportS", e.Problems); // highlight 1.5 < report 2.0 (the bad text kept the default)
        Assert.Equal(7, e.Problems.Count);
        Assert.StartsWith("my-settings.json: 7 problems in the settings: ", e.Message);
        Assert.DoesNotContain('\n', e.Message);
    }

    [Fact]
    public void Load_NotJson_IsOneProblem()
    {
        var e = Assert.Throws<AnalysisSettingsException>(() => AnalysisSettings.Load("{ rhythm: ", "x.json"));
        Assert.Single(e.Problems);
    }

    [Fact]
    public void ToJson_LoadsBackToTheSameSettings()
    {
        var s = AnalysisSettings.Load("""{ "hrv": { "nnMaxRelativeChange": 0 }, "rhythm": { "alignToClock": false } }""");
        var again = AnalysisSettings.Load(s.ToJson());
        Assert.Equal(s.Rhythm, again.Rhythm);
        Assert.Equal(s.Hrv, again.Hrv);
        Assert.Equal(s.Af, again.Af);
        Assert.Equal(s.Pauses, again.Pauses);
        Assert.Equal(s.Episodes, again.Episodes);
    }
}
