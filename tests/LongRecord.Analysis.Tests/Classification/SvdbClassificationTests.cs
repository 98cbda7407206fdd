using Xunit.Abstractions;

namespace LongRecord.Analysis.Tests.Classification;

/// <summary>
/// EC57 class figures over the records of the MIT-BIH Supraventricular Arrhythmia Database (Greenwald 1990; PhysioNet)
/// present here (128 Hz), for information: the beats issue sets no target for it. The check is that every detected
/// beat comes out classified, once and in order.
/// </summary>
public sealed class SvdbClassificationTests(ITestOutputHelper output)
{
    [Fact]
    public void Svdb_FiguresForInformation_EveryDetectedBeatClassifiedOnce()
    {
        var figures = new DatabaseFigures("svdb", []);
        var (veb, sveb) = figures.Gross(_ => true);
        output.WriteLine(figures.Table());
        output.WriteLine(DatabaseFigures.Line($"SVDB VEB gross ({figures.Results.Count} records)", veb));
        output.WriteLine(DatabaseFigures.Line($"SVDB SVEB gross ({figures.Results.Count} records)", sveb));
        output.WriteLine(figures.Worst(r => Ec57Scoring.Veb(r.Confusion), "VEB"));
        output.WriteLine(figures.Worst(r => Ec57Scoring.Sveb(r.Confusion), "SVEB"));

        foreach (var r in figures.Results)
        {
            Assert.Equal(r.Detections, r.Beats.Count);
            for (var i = 1; i < r.Beats.Count; i++)
            {
                Assert.True(r.Beats[i].Sample > r.Beats[i - 1].Sample, $"{r.Record}: beats out of order at {i}");
            }
        }
    }
}
