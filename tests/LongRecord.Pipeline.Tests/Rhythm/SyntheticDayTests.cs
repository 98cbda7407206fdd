using System.Globalization;
using LongRecord.Analysis.Rhythm;
using LongRecord.Synthesis;
using LongRecord.Synthesis.Export;
using LongRecord.Synthesis.Scenarios;
using LongRecord.TestSupport;
using Xunit.Abstractions;

namespace LongRecord.Pipeline.Tests.Rhythm;

/// <summary>
/// The synthesised 24 h demo day (fixtures/scenarios/demo-24h.json) written as EDF+ and analysed through the product's
/// path on detected beats. Rhythm issue: AF burden within 0.5 percentage points of the known AF segments; pause count
/// exact (pauses are RR ≥ 2.0 s, the settings' default).
/// </summary>
public sealed class SyntheticDayTests(ITestOutputHelper output)
{
    [Fact]
    public void Demo24h_DetectedBeats_AfBurdenWithinHalfAPoint_PauseCountExact()
    {
        using var folder = new TempFolder("day");
        var rec = SyntheticRecording.Create(ScenarioLoader.Load(Scenarios.Path("demo-24h")));
        var paths = SyntheticRecordingExport.Write(rec, folder.Path("day.edf"));
        var a = RecordingSummariser.Analyse(paths.Edf);

        var truthAfS = rec.Truth.Rhythms.Where(r => r.Kind == "af" && !r.IsEpisode).Sum(r => r.DurationS);
        var truthBurden = 100 * truthAfS / a.Rhythm.Summary.AnalysableS;
        var times = rec.Truth.Beats.Select(b => b.RTimeS).ToArray();
        var truthPauses = times.Zip(times.Skip(1), (x, y) => y - x).Count(rr => rr >= 2.0);
        var ours = a.Rhythm.Summary;
        var line = string.Create(CultureInfo.InvariantCulture,
            $"demo-24h on detected beats: AF burden {ours.AfBurdenPercent:F2} % (truth {truthBurden:F2} %), pauses {ours.PauseCount} (truth {truthPauses})");
        output.WriteLine(line);
        FiguresReport.Add("13 rhythm synthetic day", line);
        Assert.InRange(ours.AfBurdenPercent, truthBurden - 0.5, truthBurden + 0.5);
        Assert.Equal(truthPauses, ours.PauseCount);
    }
}
