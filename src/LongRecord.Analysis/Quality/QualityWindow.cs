namespace LongRecord.Analysis.Quality;

/// <summary>
/// One finished one-second quality window: samples [<see cref="StartSample"/>, <see cref="EndSample"/>), whether it
/// can be analysed, why, and the state of each lead.
/// </summary>
public readonly struct QualityWindow
{
    /// <summary>Most leads a window can describe (four bits each in one 64-bit word).</summary>
    public const int MaxLeads = 16;

    private readonly ulong _states;

    public QualityWindow(long index, long startSample, long endSample, double samplingRateHz, QualityReason reason, ReadOnlySpan<LeadState> leadStates)
        : this(index, startSample, endSample, startSample / samplingRateHz, endSample / samplingRateHz, reason, leadStates)
    {
    }

    internal QualityWindow(long index, long startSample, long endSample, double startS, double endS, QualityReason reason, ReadOnlySpan<LeadState> leadStates)
    {
        if (leadStates.Length is 0 or > MaxLeads)
        {
            throw new ArgumentOutOfRangeException(nameof(leadStates), leadStates.Length, $"a window describes 1 to {MaxLeads} leads");
        }

        Index = index;
        StartSample = startSample;
        EndSample = endSample;
        StartS = startS;
        EndS = endS;
        Reason = reason;
        LeadCount = leadStates.Length;
        ulong packed = 0;
        for (var k = 0; k < leadStates.Length; k++)
        {
            packed |= (ulong)leadStates[k] << (4 * k);
        }

        _states = packed;
    }

    /// <summary>Window number: the window covers seconds <c>Index</c> to <c>Index + 1</c> (the last one may be shorter).</summary>
    public long Index { get; }

    public long StartSample { get; }

    /// <summary>One past the last sample.</summary>
    public long EndSample { get; }

    public double StartS { get; }
    public double EndS { get; }

    /// <summary>True when at least one lead is usable; beats are detected only in analysable windows.</summary>
    public bool Analysable => Reason == QualityReason.Ok;

    public QualityReason Reason { get; }

    public int LeadCount { get; }

    /// <summary>The state of lead <paramref name="lead"/> in this window.</summary>
    public LeadState State(int lead)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(lead);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(lead, LeadCount);
        return (LeadState)((_states >> (4 * lead)) & 0xF);
    }

    /// <summary>Leads that are good or noisy.</summary>
    public int UsableLeads
    {
        get
        {
            var n = 0;
            for (var k = 0; k < LeadCount; k++)
            {
                n += State(k).IsUsable() ? 1 : 0;
            }

            return n;
        }
    }
}
