using LongRecord.Synthesis.Model;

namespace LongRecord.Synthesis.Scenarios;

/// <summary>
/// A recording script: who and when, which leads, and a timeline of rhythm segments with noise stretches laid over it.
/// Loaded from JSON by <see cref="ScenarioLoader"/>; the schema is documented in <c>fixtures/scenarios/README.md</c>.
/// </summary>
public sealed record Scenario
{
    public required string Name { get; init; }
    public string Description { get; init; } = "";
    public ScenarioPatient Patient { get; init; } = new();
    public ScenarioRecordingInfo Recording { get; init; } = new();
    public required DateTime StartDateTime { get; init; }
    public double SamplingRateHz { get; init; } = 250;
    public ulong Seed { get; init; } = 1;

    /// <summary>Repeat the timeline cyclically, or cut it, to exactly this many hours; null keeps the timeline's length.</summary>
    public double? Hours { get; init; }

    public IReadOnlyList<ScenarioLead> Leads { get; init; } = [new("ECG1", LeadView.II), new("ECG2", LeadView.V1)];
    public CircadianSettings Circadian { get; init; } = new();
    public BackgroundNoise Background { get; init; } = new();
    public required IReadOnlyList<ScenarioSegment> Segments { get; init; }
    public IReadOnlyList<NoiseStretch> Noise { get; init; } = [];

    /// <summary>Patient-diary and button events, timed from the start of the timeline (repeated with it).</summary>
    public IReadOnlyList<DiaryEntry> Diary { get; init; } = [];

    /// <summary>Length of one pass of the timeline, seconds.</summary>
    public double TimelineDurationS => Segments.Sum(s => s.DurationS);
}

/// <summary>A patient-diary or event-button entry: the recorder writes it into the file as a timed event.</summary>
/// <param name="AtS">Seconds from the start of the timeline.</param>
/// <param name="Text">What the patient pressed or wrote, for example "palpitations".</param>
public sealed record DiaryEntry(double AtS, string Text);

/// <summary>Invented patient identification written into the recording header.</summary>
public sealed record ScenarioPatient
{
    public string Name { get; init; } = "Synthetic Patient";
    public string Id { get; init; } = "SYN-0000";
    public string Sex { get; init; } = "X";
    public DateOnly? BirthDate { get; init; }
}

/// <summary>Invented recording identification (clinic, device, technician, recording code).</summary>
public sealed record ScenarioRecordingInfo
{
    public string Id { get; init; } = "SYN-REC-0000";
    public string Clinic { get; init; } = "";
    public string Device { get; init; } = "LongRecord synthesiser";
    public string Technician { get; init; } = "";
}

/// <summary>One output lead: its label in the file and the view whose wave polarities it takes.</summary>
public sealed record ScenarioLead(string Label, LeadView View);

/// <summary>Sinus rate by clock time: day and night rates with smooth transitions at the wake and sleep times.</summary>
public sealed record CircadianSettings
{
    public double DayRateBpm { get; init; } = 75;
    public double NightRateBpm { get; init; } = 55;
    public TimeOnly WakeTime { get; init; } = new(6, 30);
    public TimeOnly SleepTime { get; init; } = new(22, 30);
}

/// <summary>Low-level noise present throughout (not a truth noise stretch): RMS levels in mV; 0 turns one off.</summary>
public sealed record BackgroundNoise
{
    public double BaselineWanderMv { get; init; } = 0.04;
    public double MuscleNoiseMv { get; init; } = 0.005;
}
