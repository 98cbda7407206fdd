using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Episodes;
using LongRecord.Analysis.Quality;
using LongRecord.Analysis.Rhythm;
using LongRecord.Analysis.Settings;
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
    public static RecordingSummary Summarise(RecordingInput input, string outputRoot, SummaryOptions? options = null, CancellationToken cancellation = default, Batch.SummaryObserver? observer = null)
    {
        options ??= new SummaryOptions();
        var a = Analyse(input.Path, options, cancellation, observer);
        if (options.Report.Privacy is not null && a.BeatSource != "detected")
        {
            // The path of a --beats file may name the patient: under --deidentify only its kind is written.
            a = a with { BeatSource = $"{Path.GetExtension(a.BeatSource).TrimStart('.')} annotations (file name withheld)" };
        }

        using var folder = new OutputFolder(Path.Combine(outputRoot, input.OutputName));
        var description = new RecordingDescription(input.Name, a.Info.FormatDetail, a.Info.StartDateTime, a.DurationS, a.ReferenceRateHz,
            a.LeadLabels, a.BeatSource, a.Info.HasSignal);

        // The files are independent of one another: the per-beat files, the small tables, and the report (the longest)
        // are written side by side. Any failure still fails the whole folder, which is then never committed.
        SideBySide(
            cancellation,
            () =>
            {
                BeatsCsv.Write(folder.File("beats.csv"), a.Beats, a.ReferenceRateHz);
                BeatAnnotations.Write(folder.File($"{input.Name}.{BeatAnnotations.Annotator}"), a.Beats);
            },
            () =>
            {
                QualityCsv.Write(folder.File("quality.csv"), a.Quality);
                CsvTable.Write(folder.File("hourly.csv"), RhythmRows.TrendColumns, RhythmRows.Trend(a.Rhythm));
                CsvTable.Write(folder.File("episodes.csv"), EpisodeRows.Columns, EpisodeRows.Rows(a.Episodes));
                SummaryJson.Write(folder.File("summary.json"), description, a.Rhythm, a.Settings, a.Episodes);
            },
            () => Report.ReportOutputs.Write(folder, input, a, options.Report));
        observer?.Mark("report");
        observer?.Committing(folder.WorkPath);
        folder.Commit();
        observer?.Mark("outputs");
        return new RecordingSummary(input.Name, folder.FinalPath, a.DurationS, a.ReferenceRateHz, a.LeadLabels.Count, a.Beats.Count, a.BeatSource, a.Info.HasSignal)
        {
            Rhythm = a.Rhythm,
        };
    }

    // Runs the writers in parallel; a failure surfaces as the writer's own exception (its one-line message), not wrapped.
    private static void SideBySide(CancellationToken cancellation, params Action[] writers)
    {
        try
        {
            Parallel.Invoke(new ParallelOptions { CancellationToken = cancellation }, writers);
        }
        catch (AggregateException e) when (e.InnerExceptions.Count > 0)
        {
            System.Runtime.ExceptionServices.ExceptionDispatchInfo.Capture(e.InnerExceptions[0]).Throw();
        }
    }

    /// <summary>Reads and analyses one recording (beats, quality, rhythm, episodes) without writing anything.</summary>
    public static RecordingAnalysis Analyse(string path, SummaryOptions? options = null, CancellationToken cancellation = default, Batch.SummaryObserver? observer = null)
    {
        options ??= new SummaryOptions();
        using var reader = RecordingOpener.Open(path);
        var info = reader.Info;
        var beats = info.HasSignal ? FromSignal(reader, options, cancellation) : FromAnnotationsOnly(reader, options);
        observer?.MarkBeats(beats.Timings);
        var settings = options.Settings ?? AnalysisSettings.Default;
        var (rhythm, episodes) = RhythmAndEpisodes(reader, beats.Beats, beats.Quality, beats.ReferenceRateHz, beats.DurationS, settings, options.Diary, observer);
        return new RecordingAnalysis(info, beats.Beats, beats.Quality, rhythm, settings, beats.ReferenceRateHz, beats.DurationS, beats.LeadLabels, beats.BeatSource)
        {
            Episodes = episodes,
        };
    }

    /// <summary>
    /// The stages after the beats: rhythm, then episodes (which read the signal of <paramref name="reader"/>, when it has
    /// one, for their candidates only). Beats and quality stretches as the beats stage gave them.
    /// </summary>
    public static (RhythmResult Rhythm, EpisodeResult Episodes) RhythmAndEpisodes(IRecordingReader reader, IReadOnlyList<Beat> beats,
        IReadOnlyList<QualityStretch> quality, double referenceRateHz, double durationS, AnalysisSettings settings, string? diary = null,
        Batch.SummaryObserver? observer = null)
    {
        var info = reader.Info;
        var rhythmInput = RhythmInputOf(beats, quality, referenceRateHz, durationS, info);
        var rhythm = RhythmAnalyser.Analyse(rhythmInput, settings);
        observer?.Mark("rhythm");
        var episodes = EpisodeStage.Run(reader, info.HasSignal ? EcgChannelSelector.Select(info) : null, beats, rhythmInput.Stretches, rhythm, settings,
            referenceRateHz, durationS, diary);
        observer?.Mark("episodes");
        return (rhythm, episodes);
    }

    /// <summary>The rhythm stage's view of the beats stage's result: beats, quality stretches and the time base.</summary>
    private static RhythmInput RhythmInputOf(IReadOnlyList<Beat> beats, IReadOnlyList<QualityStretch> quality, double referenceRateHz, double durationS,
        RecordingInfo info) => new()
    {
        Beats = beats as Beat[] ?? beats.ToArray(),
        ReferenceRateHz = referenceRateHz,
        StartDateTime = info.StartDateTime,
        DurationS = durationS,
        Stretches = quality.Select(q => new SignalStretch(q.StartS, q.EndS, q.Analysable, q.Analysable ? "" : q.Reason.Code())).ToArray(),
    };

    private static BeatsResult FromSignal(IRecordingReader reader, SummaryOptions options, CancellationToken cancellation)
    {
        var channels = EcgChannelSelector.Select(reader.Info);
        var given = options.Beats is string spec ? ExternalBeats.Load(spec, reader.Info.FilePath, channels.ReferenceRateHz) : null;
        var analyser = DetectBeats(reader, channels, options.BlockSamples, cancellation, given, options.SecondBeatsThread);
        var labels = channels.Indices.Select(i => reader.Info.Channels[i].Label).ToArray();
        return new BeatsResult(analyser.Beats, analyser.Quality, channels.ReferenceRateHz, reader.Info.DurationS, labels, given?.Source ?? "detected") { Timings = analyser.Timings };
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
        return new BeatsResult(BeatsFromAnnotations.Build(given, fRef), [whole], fRef, duration, [], given.Source);
    }

    /// <summary>Streams the chosen channels through the beats stage.</summary>
    public static BeatAnalyser DetectBeats(IRecordingReader reader, EcgChannels channels, int blockSamples, CancellationToken cancellation = default, ExternalBeats? given = null, bool secondThread = false)
    {
        var analyser = new BeatAnalyser(channels.ReferenceRateHz, channels.Indices.Length, given?.Samples, given?.Classes, SaturationRails.For(reader.Info, channels), secondThread);
        try
        {
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
        }
        finally
        {
            analyser.Dispose();
        }

        return analyser;
    }

    private sealed record BeatsResult(IReadOnlyList<Beat> Beats, IReadOnlyList<QualityStretch> Quality, double ReferenceRateHz, double DurationS, IReadOnlyList<string> LeadLabels, string BeatSource)
    {
        public BeatStageTimings? Timings { get; init; }
    }
}
