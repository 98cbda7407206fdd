using System.Globalization;
using LongRecord.Synthesis;
using LongRecord.Synthesis.Scenarios;
using LongRecord.Synthesis.Truth;
using Xunit.Abstractions;

namespace LongRecord.Analysis.Tests.Delineation;

/// <summary>
/// QRS width against the synthesiser's exact truth (fixtures/scenarios/README.md: onset/offset = the earliest/latest
/// point over all leads where the Q+R+S sum reaches 2 % of that lead's largest excursion). Targets of the brief:
/// median |width − truth width| ≤ 8 ms over all beats, narrow/broad agreement at 120 ms ≥ 98 %; a beat with no width
/// counts as an error (and as a disagreement).
/// </summary>
public sealed class SyntheticQrsWidthTests(ITestOutputHelper output)
{
    private static readonly string[] s_catalogue =
        ["sinus-with-pacs", "ve-runs", "ventricular-bigeminy", "broad-tachycardia", "psvt-180", "af", "flutter-2to1-150", "mat"];

    [Fact]
    public void Catalogue_At250Hz_WidthMatchesTruth()
    {
        var total = new WidthTally();
        foreach (var name in s_catalogue)
        {
            var tally = Measure(name, 250);
            output.WriteLine($"{name,-22} 250 Hz {tally}");
            total.Add(tally);
        }

        output.WriteLine($"all scenarios          250 Hz {total}");
        Assert.True(total.MedianAbsoluteErrorMs <= 8, Inv($"median |width error| {total.MedianAbsoluteErrorMs:F1} ms > 8 ms"));
        Assert.True(total.Agreement >= 0.98, Inv($"narrow/broad agreement {100 * total.Agreement:F1} % < 98 %"));
    }

    /// <summary>The same targets from 128 Hz (the rate of the MIT-BIH Supraventricular Arrhythmia Database) to 1000 Hz.</summary>
    [Theory]
    [InlineData(128)]
    [InlineData(500)]
    [InlineData(1000)]
    public void VentricularBigeminy_AtOtherRates_WidthMatchesTruth(double samplingRateHz)
    {
        var tally = Measure("ventricular-bigeminy", samplingRateHz);
        output.WriteLine(Inv($"ventricular-bigeminy {samplingRateHz} Hz {tally}"));
        Assert.True(tally.MedianAbsoluteErrorMs <= 8, Inv($"median |width error| {tally.MedianAbsoluteErrorMs:F1} ms > 8 ms"));
        Assert.True(tally.Agreement >= 0.98, Inv($"narrow/broad agreement {100 * tally.Agreement:F1} % < 98 %"));
    }

    private static WidthTally Measure(string scenario, double samplingRateHz)
    {
        var recording = SyntheticRecording.Create(ScenarioLoader.Load(ScenarioFolder.File(scenario)), new SynthesisOptions { SamplingRateHz = samplingRateHz });
        var leads = recording.Leads.Count;
        var n = checked((int)recording.SampleCount);
        var block = new float[leads * n];
        recording.Render(0, n, block);
        var raw = new float[leads][];
        for (var k = 0; k < leads; k++)
        {
            raw[k] = block.AsSpan(k * n, n).ToArray();
        }

        var beats = recording.Truth.Beats;
        var results = DelineationRun.Run(DelineationRun.Condition(raw, samplingRateHz), samplingRateHz, beats.Select(b => b.RSample).ToArray());
        var tally = new WidthTally();
        for (var i = 0; i < beats.Count; i++)
        {
            tally.Add(beats[i], results[i]);
        }

        return tally;
    }

    private static string Inv(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);

    private sealed class WidthTally
    {
        private readonly List<double> _absoluteErrors = new();
        private int _agree;
        private int _missing;
        private int _broad;

        public int Count => _absoluteErrors.Count;

        public double Agreement => Count == 0 ? 0 : (double)_agree / Count;

        public double MedianAbsoluteErrorMs
        {
            get
            {
                var s = _absoluteErrors.OrderBy(v => v).ToArray();
                return s.Length == 0 ? double.NaN : s[s.Length / 2];
            }
        }

        public void Add(TruthBeat truth, DelineatedBeat result)
        {
            _broad += truth.QrsWidthMs >= 120 ? 1 : 0;
            if (!result.HasQrsBounds)
            {
                _missing++;
                _absoluteErrors.Add(double.PositiveInfinity);
                return;
            }

            _absoluteErrors.Add(Math.Abs(result.QrsMs - truth.QrsWidthMs));
            _agree += (result.QrsMs >= 120) == (truth.QrsWidthMs >= 120) ? 1 : 0;
        }

        public void Add(WidthTally other)
        {
            _absoluteErrors.AddRange(other._absoluteErrors);
            _agree += other._agree;
            _missing += other._missing;
            _broad += other._broad;
        }

        public override string ToString() => string.Create(
            CultureInfo.InvariantCulture,
            $"beats {Count,4} (broad {_broad,4}): median |error| {MedianAbsoluteErrorMs,4:F1} ms, agreement at 120 ms {100 * Agreement:F1} %, no width {_missing}");
    }
}

/// <summary>Locates <c>fixtures/scenarios</c> in the repository above the test assembly.</summary>
internal static class ScenarioFolder
{
    public static string File(string name)
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "fixtures", "scenarios", name + ".json");
            if (System.IO.File.Exists(candidate))
            {
                return candidate;
            }
        }

        throw new FileNotFoundException($"fixtures/scenarios/{name}.json not found above {AppContext.BaseDirectory}");
    }
}
