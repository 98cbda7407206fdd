namespace LongRecord.Formats;

/// <summary>Everything a reader knows about a recording before any sample is read.</summary>
public sealed record RecordingInfo
{
    /// <summary>The file the recording was opened from (for WFDB, the header).</summary>
    public required string FilePath { get; init; }

    public required RecordingFormat Format { get; init; }

    /// <summary>Human-readable variant, for example <c>EDF+D</c> or <c>WFDB (formats 212)</c>.</summary>
    public required string FormatDetail { get; init; }

    /// <summary>All stored signals, in file order, annotation-only signals excluded. May be empty.</summary>
    public required IReadOnlyList<ChannelInfo> Channels { get; init; }

    /// <summary>
    /// Date of the first sample as recorded (device local time, no time-zone conversion), or null when the file has none.
    /// </summary>
    public DateOnly? StartDate { get; init; }

    /// <summary>Clock time of the first sample as recorded, or null when the file has none.</summary>
    public TimeOnly? StartTime { get; init; }

    /// <summary>Elapsed seconds from the first sample to the end of the last, gaps included.</summary>
    public required double DurationS { get; init; }

    public Identification Identification { get; init; } = new();

    /// <summary>Free-text comment lines (WFDB <c>#</c> lines, ISHNE variable block).</summary>
    public IReadOnlyList<string> Comments { get; init; } = [];

    public IReadOnlyList<RecordingGap> Gaps { get; init; } = [];

    public IReadOnlyList<RecordingEvent> Events { get; init; } = [];

    /// <summary>False when the recording's samples cannot be read (for example a WFDB header whose signal file is absent).</summary>
    public bool HasSignal { get; init; } = true;

    /// <summary>Why <see cref="HasSignal"/> is false, for example <c>no signal file</c>.</summary>
    public string? NoSignalReason { get; init; }

    /// <summary>Start as a local date-time when both date and time are known.</summary>
    public DateTime? StartDateTime =>
        StartDate is DateOnly d && StartTime is TimeOnly t ? d.ToDateTime(t, DateTimeKind.Unspecified) : null;
}
