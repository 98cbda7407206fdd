using System.Globalization;
using LongRecord.Formats;
using LongRecord.Synthesis.Model;
using LongRecord.Synthesis.Randomness;
using LongRecord.Synthesis.Rendering;
using LongRecord.Synthesis.Scenarios;
using LongRecord.Synthesis.Timeline;
using LongRecord.Synthesis.Truth;

namespace LongRecord.Synthesis;

/// <summary>
/// A synthetic multi-lead ECG recording built from a <see cref="Scenario"/>: its header facts, its exact ground
/// truth, and a renderer that produces any block of samples on demand. Building it schedules every beat (memory
/// <see cref="RecordingTruth.BytesPerBeat"/> bytes per beat); rendering holds no per-recording sample memory.
/// Same scenario and seed give the same samples bit for bit, whatever the block sizes. Render calls share no mutable
/// state, so several threads may render different blocks of one instance at once.
/// </summary>
public sealed class SyntheticRecording
{
    private readonly BeatRenderer _beats;
    private readonly ContinuousRenderer _continuous;
    private readonly NoiseRenderer _noise;

    private SyntheticRecording(Scenario scenario, SynthesisOptions options)
    {
        Scenario = scenario;
        Options = options;
        SamplingRateHz = options.SamplingRateHz ?? scenario.SamplingRateHz;
        if (SamplingRateHz is < 100 or > 1000 || !double.IsFinite(SamplingRateHz))
        {
            throw new ArgumentOutOfRangeException(nameof(options), SamplingRateHz, "sampling rate must be between 100 and 1000 Hz");
        }

        Seed = options.Seed ?? scenario.Seed;
        StartDateTime = options.StartDateTime ?? scenario.StartDateTime;
        var hours = options.Hours ?? scenario.Hours;
        if (hours is double h && (h <= 0 || h > 24 * 14))
        {
            throw new ArgumentOutOfRangeException(nameof(options), h, "hours must be above 0 and at most 336 (14 days)");
        }

        var wanted = hours is double hh ? hh * 3600.0 : scenario.TimelineDurationS;
        SampleCount = (long)Math.Round(wanted * SamplingRateHz);
        DurationS = SampleCount / SamplingRateHz;
        Leads = scenario.Leads.Select(l => l.Label).ToArray();
        LeadViews = scenario.Leads.Select(l => l.View).ToArray();

        var morph = new LeadMorphologies(LeadViews);
        var (segments, noise) = TimelinePlan.Place(scenario, DurationS);
        var schedule = new BeatScheduler(scenario, StartDateTime, Seed, morph, DurationS).Run(segments);

        var sources = new NoiseSource[noise.Count];
        var intervals = new List<NoiseInterval>();
        var masks = new List<int>();
        for (var i = 0; i < noise.Count; i++)
        {
            var placed = noise[i];
            var leadMask = Leads.Select(l => placed.Stretch.Leads.Count == 0 || placed.Stretch.Leads.Contains(l)).ToArray();
            sources[i] = new NoiseSource(placed, CounterRandom.Hash(Seed, 500, i), SamplingRateHz, SampleCount, leadMask);
            NoiseCalibration.Calibrate(sources[i], schedule.Complexes, morph);
            intervals.Add(new NoiseInterval
            {
                Kind = NoiseReader.Name(placed.Stretch.Kind),
                StartS = placed.StartS,
                EndS = placed.EndS,
                StartSample = sources[i].StartSample,
                EndSample = sources[i].EndSample,
                SnrDb = placed.Stretch.SnrDb,
                Leads = Leads.Where((_, k) => leadMask[k]).ToArray(),
                LeadOffMode = placed.Stretch.Kind == NoiseKind.LeadOff ? NoiseReader.Name(placed.Stretch.Mode) : null,
            });
            masks.Add(leadMask.Select((on, k) => on ? 1 << k : 0).Sum());
        }

        _beats = new BeatRenderer(schedule.Complexes, new WaveTable(LeadViews), morph, SamplingRateHz);
        _continuous = new ContinuousRenderer(schedule.Sources, LeadViews, SamplingRateHz);
        _noise = new NoiseRenderer(sources, scenario.Background, Seed, SamplingRateHz, Leads.Count);
        var rhythms = schedule.Intervals.Select(ToInterval).OrderBy(r => r.StartS).ToArray();
        Truth = new RecordingTruth(schedule.Complexes, schedule.Sources, morph, SamplingRateHz, rhythms, intervals, masks);
        Identification = MakeIdentification(scenario, StartDateTime);
    }

    /// <summary>Schedules the recording described by <paramref name="scenario"/> with optional overrides.</summary>
    public static SyntheticRecording Create(Scenario scenario, SynthesisOptions? options = null) => new(scenario, options ?? new SynthesisOptions());

    public Scenario Scenario { get; }
    public SynthesisOptions Options { get; }

    /// <summary>Lead labels, in render order.</summary>
    public IReadOnlyList<string> Leads { get; }

    public IReadOnlyList<LeadView> LeadViews { get; }
    public double SamplingRateHz { get; }
    public ulong Seed { get; }
    public double DurationS { get; }
    public long SampleCount { get; }

    /// <summary>Local clock time of the first sample.</summary>
    public DateTime StartDateTime { get; }

    /// <summary>Invented patient and recording identification, with the EDF+ style fields filled in.</summary>
    public Identification Identification { get; }

    public RecordingTruth Truth { get; }

    /// <summary>
    /// The scenario's diary entries laid on the recording's timeline (repeated with the timeline, cut with it): events a
    /// recorder stores in the file, not truth.
    /// </summary>
    public IReadOnlyList<DiaryEntry> Diary
    {
        get
        {
            var list = new List<DiaryEntry>();
            var cycle = Scenario.TimelineDurationS;
            for (var offset = 0.0; cycle > 0 && offset < DurationS; offset += cycle)
            {
                foreach (var e in Scenario.Diary)
                {
                    if (offset + e.AtS < DurationS)
                    {
                        list.Add(e with { AtS = offset + e.AtS });
                    }
                }
            }

            return list;
        }
    }

    /// <summary>Physical unit of every lead.</summary>
    public string PhysicalUnit => "mV";

    /// <summary>
    /// Fills <paramref name="destination"/> with samples <paramref name="start"/> … start + count − 1 of every lead,
    /// lead after lead (lead k at k × count), in mV, including the components chosen in <see cref="Options"/>.
    /// </summary>
    public void Render(long start, int count, Span<float> destination) => Render(start, count, destination, Options.Components);

    /// <summary>As <see cref="Render(long, int, Span{float})"/>, with the components given explicitly (Ecg alone = clean signal).</summary>
    public void Render(long start, int count, Span<float> destination, SignalComponents components)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        if (start < 0 || start + count > SampleCount)
        {
            throw new ArgumentOutOfRangeException(nameof(start), start, $"range [{start}, {start + count}) is outside the recording's {SampleCount} samples");
        }

        if (destination.Length < (long)Leads.Count * count)
        {
            throw new ArgumentException("destination is shorter than leads × count", nameof(destination));
        }

        var block = destination[..(Leads.Count * count)];
        block.Clear();
        if ((components & SignalComponents.Ecg) != 0)
        {
            _beats.Render(start, count, Leads.Count, block);
            _continuous.Render(start, count, block);
        }

        if ((components & SignalComponents.BackgroundNoise) != 0)
        {
            _noise.AddBackground(start, count, block);
        }

        if ((components & SignalComponents.NoiseStretches) != 0)
        {
            _noise.AddStretches(start, count, block);
            _noise.ApplyLeadOff(start, count, block);
        }
    }

    private RhythmInterval ToInterval(IntervalDraft d) => new()
    {
        Kind = d.Kind,
        Label = RhythmLabels.Text(d.Label),
        StartS = d.StartS,
        EndS = d.EndS,
        StartSample = (long)Math.Round(d.StartS * SamplingRateHz),
        EndSample = (long)Math.Round(d.EndS * SamplingRateHz),
        Onset = d.Onset,
        Offset = d.Offset,
        IsEpisode = d.IsEpisode,
        SegmentIndex = d.SegmentIndex,
        BeatCount = d.BeatCount,
        Parameters = d.Parameters,
        Settings = d.Settings,
    };

    private static Identification MakeIdentification(Scenario s, DateTime start)
    {
        static string Word(string text) => string.IsNullOrWhiteSpace(text) ? "X" : text.Trim().Replace(' ', '_');
        static string EdfDate(DateTime d) => d.ToString("dd-MMM-yyyy", CultureInfo.InvariantCulture).ToUpperInvariant();
        var birth = s.Patient.BirthDate is DateOnly b ? EdfDate(b.ToDateTime(TimeOnly.MinValue)) : "X";
        return new Identification
        {
            // EDF+ local patient identification: code, sex, birth date, name (EDF+ specification section 2.1.3.3, from memory).
            PatientField = $"{Word(s.Patient.Id)} {Word(s.Patient.Sex)} {birth} {Word(s.Patient.Name)}",
            // EDF+ local recording identification: "Startdate", date, recording code, technician, equipment.
            RecordingField = $"Startdate {EdfDate(start)} {Word(s.Recording.Id)} {Word(s.Recording.Technician)} {Word(s.Recording.Device)}",
            PatientName = s.Patient.Name,
            PatientId = s.Patient.Id,
            Sex = s.Patient.Sex,
            BirthDate = s.Patient.BirthDate?.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture),
        };
    }
}
