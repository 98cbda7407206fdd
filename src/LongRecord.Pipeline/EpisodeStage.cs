using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Conditioning;
using LongRecord.Analysis.Episodes;
using LongRecord.Analysis.Rhythm;
using LongRecord.Analysis.Settings;
using LongRecord.Formats;
using LongRecord.Pipeline.Channels;

namespace LongRecord.Pipeline;

/// <summary>
/// The edge of the episode stage: gathers the symptom events (the recording's own annotations and a diary file,
/// <c>&lt;recording name&gt;.diary.csv</c> beside it or the one given), and serves the analysis the conditioned signal
/// of just the stretches it asks for, by positioned block reads (memory bounded by the longest stretch asked for).
/// </summary>
public sealed class EpisodeStage : IEpisodeSignal
{
    /// <summary>Seconds read before a requested stretch so the conditioning filters have settled.</summary>
    private const double SettleS = 2;

    private readonly IRecordingReader _reader;
    private readonly EcgChannels _channels;
    private float[] _buffer = [];

    private EpisodeStage(IRecordingReader reader, EcgChannels channels)
    {
        _reader = reader;
        _channels = channels;
    }

    public double SamplingRateHz => _channels.ReferenceRateHz;

    public int Leads => _channels.Indices.Length;

    public long SampleCount => _channels.SampleCount;

    /// <summary>Runs the episode stage for one recording; <paramref name="channels"/> null when the beats have no signal.</summary>
    public static EpisodeResult Run(IRecordingReader reader, EcgChannels? channels, IReadOnlyList<Beat> beats, IReadOnlyList<SignalStretch> stretches,
        RhythmResult rhythm, AnalysisSettings settings, double referenceRateHz, double durationS, string? diaryPath)
    {
        var info = reader.Info;
        var events = new List<SymptomEventInput>();
        foreach (var e in info.Events)
        {
            if (!string.IsNullOrWhiteSpace(e.Text))
            {
                events.Add(new SymptomEventInput(e.OnsetS, e.Text.Trim(), "recording"));
            }
        }

        events.AddRange(Diary(info, diaryPath));
        var input = new EpisodeInput
        {
            Beats = beats as Beat[] ?? beats.ToArray(),
            ReferenceRateHz = referenceRateHz,
            DurationS = durationS,
            StartDateTime = info.StartDateTime,
            Stretches = stretches,
            Rhythm = rhythm,
            Events = events,
        };
        var signal = channels is not null && info.HasSignal ? new EpisodeStage(reader, channels) : null;
        return EpisodeAnalyser.Analyse(input, settings, signal);
    }

    /// <summary>The diary beside the recording (<c>&lt;name&gt;.diary.csv</c>) or the one named; none when neither exists.</summary>
    public static IReadOnlyList<SymptomEventInput> Diary(RecordingInfo info, string? diaryPath)
    {
        var path = diaryPath;
        if (path is null)
        {
            var beside = Path.Combine(Path.GetDirectoryName(Path.GetFullPath(info.FilePath)) ?? ".", Path.GetFileNameWithoutExtension(info.FilePath) + ".diary.csv");
            if (!File.Exists(beside))
            {
                return [];
            }

            path = beside;
        }

        if (!File.Exists(path))
        {
            throw new RecordingFormatException(path, "diary file not found");
        }

        string text;
        using (var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read))
        using (var r = new StreamReader(stream))
        {
            text = r.ReadToEnd();
        }

        var parsed = DiaryText.Parse(text, info.StartDateTime);
        return parsed.Problem is string problem ? throw new RecordingFormatException(path, problem, parsed.ByteOffset, "time") : parsed.Events;
    }

    public void Read(long start, int count, Span<float> destination)
    {
        var leads = Leads;
        var settle = (int)Math.Min(start, (long)Math.Round(SettleS * SamplingRateHz));
        var total = settle + count;
        if (_buffer.Length < leads * total)
        {
            _buffer = new float[leads * total];
        }

        var block = _buffer.AsSpan(0, leads * total);
        _reader.Read(_channels.Indices, start - settle, total, block);
        for (var k = 0; k < leads; k++)
        {
            var lead = block.Slice(k * total, total);
            new EcgConditioner(SamplingRateHz).Process(lead);
            lead.Slice(settle, count).CopyTo(destination.Slice(k * count, count));
        }
    }
}
