using LongRecord.Pipeline.Batch;
using LongRecord.Pipeline.Inputs;
using LongRecord.Synthesis;
using LongRecord.Synthesis.Export;
using LongRecord.Synthesis.Scenarios;
using LongRecord.TestSupport;

namespace LongRecord.Pipeline.Tests.Batch;

/// <summary>
/// An interrupted batch (Ctrl+C, a scheduler's time limit) leaves no partial folder (batch issue: "no half-written
/// result ever appears under its final name") and writes no index.
/// </summary>
public sealed class BatchCancellationTests
{
    [Fact]
    public void CancelledWhileARecordingIsAnalysed_NoFolderForIt_NoLeftovers_NoIndex()
    {
        using var input = new TempFolder("cancel");
        using var output = new TempFolder("cancel-out");
        var scenario = ScenarioLoader.Load(Scenarios.Path("sinus-rest"));
        SyntheticRecordingExport.Write(SyntheticRecording.Create(scenario, new SynthesisOptions { Hours = 0.05 }), input.Path("rec.edf"));
        var inputs = RecordingDiscovery.Find([input.FullPath]);
        using var cancel = new CancellationTokenSource();
        // Small blocks: the beats pass checks for cancellation before each one.
        var options = new BatchOptions { Jobs = 1, Summary = new SummaryOptions { BlockSamples = 250 } };

        Assert.ThrowsAny<OperationCanceledException>(() => BatchRunner.Run(inputs, output.FullPath, options, new CancelOnStart(cancel), cancel.Token));

        Assert.Empty(Directory.GetFileSystemEntries(output.FullPath));
    }

    private sealed class CancelOnStart(CancellationTokenSource cancel) : IBatchProgress
    {
        public void Planned(int found, int inThisRun, ShardSpec shard)
        {
        }

        public void Started(RecordingInput input, string reason) => cancel.Cancel();

        public void Finished(BatchEntry entry)
        {
        }
    }
}
