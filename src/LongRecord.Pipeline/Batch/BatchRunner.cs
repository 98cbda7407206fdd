using System.Collections.Concurrent;
using System.Diagnostics;
using LongRecord.Formats;
using LongRecord.Pipeline.Inputs;

namespace LongRecord.Pipeline.Batch;

/// <summary>
/// The overnight batch: the recordings of this run (or shard) analysed several at a time, each into its own folder
/// under the output root. A recording is skipped when its folder's fingerprint matches; one that cannot be read gets
/// an error entry and the others go on; what a killed run left behind is removed first. Ends by writing the index.
/// </summary>
public static class BatchRunner
{
    /// <param name="all">The whole sorted input list (<see cref="RecordingDiscovery.Find"/>); output names are decided on it.</param>
    public static BatchResult Run(IReadOnlyList<RecordingInput> all, string outputRoot, BatchOptions options, IBatchProgress? progress = null, CancellationToken cancellation = default)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(options.Jobs, 1);
        outputRoot = Path.GetFullPath(outputRoot);
        Directory.CreateDirectory(outputRoot);
        // Outputs of an earlier run under an input folder are not recordings (the list keeps its order, so names stay).
        var candidates = all.Where(i => !IsUnder(Path.GetFullPath(i.Path), outputRoot)).ToArray();
        var mine = options.Shard.Select(candidates);
        progress?.Planned(candidates.Length, mine.Count, options.Shard);

        // A recording's beats stage takes a second thread only when the batch leaves a core free for it.
        options = options with { Summary = options.Summary with { SecondBeatsThread = Math.Min(options.Jobs, mine.Count) < Environment.ProcessorCount } };
        var listings = new ConcurrentDictionary<string, string[]>(StringComparer.Ordinal);
        var runOptions = new RunOptions(options, folder => listings.GetOrAdd(folder, Directory.GetFiles));
        var entries = new BatchEntry[mine.Count];
        try
        {
            Parallel.ForEach(
                Partitioner.Create(Enumerable.Range(0, mine.Count), EnumerablePartitionerOptions.NoBuffering),
                new ParallelOptions { MaxDegreeOfParallelism = options.Jobs, CancellationToken = cancellation },
                i =>
                {
                    entries[i] = RunOne(mine[i], outputRoot, runOptions, progress, cancellation);
                    progress?.Finished(entries[i]);
                });
        }
        catch (AggregateException e) when (e.InnerExceptions.All(x => x is OperationCanceledException))
        {
            throw new OperationCanceledException("batch cancelled", e, cancellation);
        }

        var (csv, html) = BatchIndex.Write(outputRoot, options.Shard, entries);
        return new BatchResult(candidates.Length, options.Shard, entries, csv, html);
    }

    /// <summary>One recording: leftovers removed, fingerprint compared, analysed when it differs.</summary>
    public static BatchEntry RunOne(RecordingInput input, string outputRoot, BatchOptions options, IBatchProgress? progress = null, CancellationToken cancellation = default) =>
        RunOne(input, outputRoot, new RunOptions(options, null), progress, cancellation);

    private static BatchEntry RunOne(RecordingInput input, string outputRoot, RunOptions run, IBatchProgress? progress, CancellationToken cancellation)
    {
        var options = run.Batch;
        var clock = Stopwatch.StartNew();
        try
        {
            StaleOutputs.Remove(outputRoot, input.OutputName);
            // Opening first gives a damaged or missing recording its reader's own one-line error, and names the file
            // the fingerprint hashes (a WFDB record given by name or by its .dat resolves to its header).
            string opened;
            using (var reader = RecordingOpener.Open(input.Path))
            {
                opened = reader.Info.FilePath;
            }

            var final = Path.Combine(outputRoot, input.OutputName);
            var earlier = Directory.Exists(final) ? RecordingFingerprint.Read(final) : null;
            Func<RecordingFingerprint> compute = () => RecordingFingerprint.Compute(input with { Path = opened }, options.Summary, listFolder: run.ListFolder);
            Task<RecordingFingerprint> fingerprint;
            string? why;
            if (earlier is null || options.Force)
            {
                // It will be analysed whatever the fingerprint says: hash the inputs beside the analysis, not before it.
                fingerprint = Task.Run(compute, cancellation);
                why = earlier is null ? "no earlier result" : "--force";
            }
            else
            {
                fingerprint = Task.FromResult(compute());
                why = fingerprint.Result.DifferenceFrom(earlier);
                if (why is null)
                {
                    return new BatchEntry(input, BatchStatus.Unchanged, "fingerprint matches") { ElapsedS = clock.Elapsed.TotalSeconds };
                }
            }

            progress?.Started(input, why);
            var observer = new SummaryObserver { BeforeCommit = work => fingerprint.GetAwaiter().GetResult().Write(work) };
            observer.Start();
            var summary = RecordingSummariser.Summarise(input, outputRoot, options.Summary, cancellation, observer);
            return new BatchEntry(input, BatchStatus.Done, why) { Summary = summary, Timings = observer.Timings, ElapsedS = clock.Elapsed.TotalSeconds };
        }
        catch (OperationCanceledException)
        {
            throw;
        }
        catch (RecordingFormatException e)
        {
            return Failed(input, FailureText.Of(e, input), clock, fault: false);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return Failed(input, FailureText.OfIo(e, input), clock, fault: false);
        }
        catch (Exception e)
        {
            // One recording that trips a fault must not cost the night's other reports; the exit code still says so.
            return Failed(input, FailureText.OfFault(e, input), clock, fault: true) with { Fault = e };
        }
    }

    private static BatchEntry Failed(RecordingInput input, string reason, Stopwatch clock, bool fault) =>
        new(input, BatchStatus.Failed, reason) { ElapsedS = clock.Elapsed.TotalSeconds, InternalFault = fault };

    // The batch's options and what its workers share: one listing per folder for the side files.
    private sealed record RunOptions(BatchOptions Batch, Func<string, IReadOnlyList<string>>? ListFolder);

    private static bool IsUnder(string path, string folder) => path.StartsWith(folder + Path.DirectorySeparatorChar, StringComparison.Ordinal);
}
