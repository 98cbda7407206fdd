using LongRecord.Analysis.Beats;
using LongRecord.Formats;
using LongRecord.Pipeline.Channels;
using LongRecord.Pipeline.Inputs;
using LongRecord.Pipeline.Outputs;

namespace LongRecord.Pipeline;

/// <summary>
/// One recording through the flow: read in blocks → beats → outputs in <c>OUT/&lt;name&gt;/</c>, written under a
/// temporary folder name and renamed when complete.
/// </summary>
public static class RecordingSummariser
{
    public static RecordingSummary Summarise(RecordingInput input, string outputRoot, SummaryOptions? options = null, CancellationToken cancellation = default)
    {
        options ??= new SummaryOptions();
        using var reader = RecordingOpener.Open(input.Path);
        var info = reader.Info;
        if (!info.HasSignal)
        {
            throw new RecordingFormatException(info.FilePath, $"{info.NoSignalReason ?? "no signal"}: nothing to detect beats in (give --beats to analyse an annotation file)");
        }

        var channels = EcgChannelSelector.Select(info);
        var beats = DetectBeats(reader, channels, options.BlockSamples, cancellation);

        using var folder = new OutputFolder(Path.Combine(outputRoot, input.OutputName));
        BeatsCsv.Write(folder.File("beats.csv"), beats.Beats, channels.ReferenceRateHz);
        BeatAnnotations.Write(folder.File($"{input.Name}.{BeatAnnotations.Annotator}"), beats.Beats);
        folder.Commit();
        return new RecordingSummary(input.Name, folder.FinalPath, info.DurationS, channels.ReferenceRateHz, channels.Indices.Length, beats.Beats.Count);
    }

    /// <summary>Streams the chosen channels through the beats stage.</summary>
    public static BeatAnalyser DetectBeats(IRecordingReader reader, EcgChannels channels, int blockSamples, CancellationToken cancellation = default)
    {
        var analyser = new BeatAnalyser(channels.ReferenceRateHz, channels.Indices.Length);
        var buffer = new float[channels.Indices.Length * blockSamples];
        for (long start = 0; start < channels.SampleCount; start += blockSamples)
        {
            cancellation.ThrowIfCancellationRequested();
            var count = (int)Math.Min(blockSamples, channels.SampleCount - start);
            var block = buffer.AsSpan(0, channels.Indices.Length * count);
            reader.Read(channels.Indices, start, count, block);
            analyser.Process(block, count);
        }

        analyser.Complete();
        return analyser;
    }
}
