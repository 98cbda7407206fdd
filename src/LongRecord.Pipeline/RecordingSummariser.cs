using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Quality;
using LongRecord.Formats;
using LongRecord.Formats.Wfdb;
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
        var analysis = info.HasSignal ? FromSignal(reader, options, cancellation) : FromAnnotationsOnly(reader, options);

        using var folder = new OutputFolder(Path.Combine(outputRoot, input.OutputName));
        BeatsCsv.Write(folder.File("beats.csv"), analysis.Beats, analysis.ReferenceRateHz);
        BeatAnnotations.Write(folder.File($"{input.Name}.{BeatAnnotations.Annotator}"), analysis.Beats);
        QualityCsv.Write(folder.File("quality.csv"), analysis.Quality);
        folder.Commit();
        return new RecordingSummary(input.Name, folder.FinalPath, analysis.DurationS, analysis.ReferenceRateHz, analysis.Leads, analysis.Beats.Count, analysis.BeatSource, info.HasSignal);
    }

    private static BeatsResult FromSignal(IRecordingReader reader, SummaryOptions options, CancellationToken cancellation)
    {
        var channels = EcgChannelSelector.Select(reader.Info);
        var given = options.Beats is string spec ? ExternalBeats.Load(spec, reader.Info.FilePath, channels.ReferenceRateHz) : null;
        var analyser = DetectBeats(reader, channels, options.BlockSamples, cancellation, given);
        return new BeatsResult(analyser.Beats, analyser.Quality, channels.ReferenceRateHz, reader.Info.DurationS, channels.Indices.Length, given?.Source ?? "detected");
    }

    // No signal (a header whose signal file is absent, or one that declares no signals): beats from annotations only.
    private static BeatsResult FromAnnotationsOnly(IRecordingReader reader, SummaryOptions options)
    {
        var info = reader.Info;
        if (options.Beats is not string spec)
        {
            throw new RecordingFormatException(info.FilePath, $"{info.NoSignalReason ?? "no signal"}: nothing to detect beats in (give --beats to analyse an annotation file)");
        }

        var fRef = info.Channels.Count > 0 ? info.Channels[0].SamplingRateHz
            : reader is WfdbRecordReader w ? w.Header.SamplingFrequencyHz
            : throw new RecordingFormatException(info.FilePath, "no sampling rate to place the annotations on");
        var given = ExternalBeats.Load(spec, info.FilePath, fRef);
        var duration = Math.Max(info.DurationS, (given.LastAnnotationSample + 1) / fRef);
        // No signal, so no verdict on it: the whole recording is one stretch, analysable as far as the annotations go.
        var whole = new QualityStretch(0, (long)Math.Round(duration * fRef), 0, duration, true, QualityReason.Ok);
        return new BeatsResult(BeatsFromAnnotations.Build(given, fRef), [whole], fRef, duration, 0, given.Source);
    }

    /// <summary>Streams the chosen channels through the beats stage.</summary>
    public static BeatAnalyser DetectBeats(IRecordingReader reader, EcgChannels channels, int blockSamples, CancellationToken cancellation = default, ExternalBeats? given = null)
    {
        var analyser = new BeatAnalyser(channels.ReferenceRateHz, channels.Indices.Length, given?.Samples, given?.Classes, SaturationRails.For(reader.Info, channels));
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

    private sealed record BeatsResult(IReadOnlyList<Beat> Beats, IReadOnlyList<QualityStretch> Quality, double ReferenceRateHz, double DurationS, int Leads, string BeatSource);
}
