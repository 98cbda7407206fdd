namespace LongRecord.Analysis.Quality;

/// <summary>
/// Turns per-window lead features into final windows once enough later windows are known. Unreadable noise must last
/// <see cref="QualitySettings.UnreadableMinWindows"/> windows on a lead (a morphological opening: short bursts stay
/// usable, because expert-annotated beats in them would count as missed); chaotic windows are opened and then closed
/// with <see cref="QualitySettings.ChaoticMinWindows"/>, so fibrillation is reported as one stretch.
/// </summary>
internal sealed class WindowDecisions
{
    public const int MaxRunWindows = 9;
    private const int Ring = 64;

    private readonly QualitySettings _settings;
    private readonly int _leads;
    private readonly double _fs;
    private readonly int _unreadableRadius;
    private readonly int _chaoticRadius;
    private readonly long[] _start = new long[Ring];
    private readonly long[] _end = new long[Ring];
    private readonly bool[] _chaotic = new bool[Ring];
    private readonly LeadWindowFeatures[][] _features = new LeadWindowFeatures[Ring][];
    private long _added;
    private long _decided;
    private bool _ended;

    public WindowDecisions(QualitySettings settings, int leads, double samplingRateHz)
    {
        _settings = settings;
        _leads = leads;
        _fs = samplingRateHz;
        _unreadableRadius = (settings.UnreadableMinWindows - 1) / 2;
        _chaoticRadius = (settings.ChaoticMinWindows - 1) / 2;
        for (var i = 0; i < Ring; i++)
        {
            _features[i] = new LeadWindowFeatures[leads];
        }
    }

    /// <summary>Later windows a decision waits for.</summary>
    public int LookaheadWindows => Math.Max(2 * _unreadableRadius, 4 * _chaoticRadius);

    /// <summary>Adds window number <c>Added</c>; <paramref name="features"/> holds one entry per lead.</summary>
    public void Add(long startSample, long endSample, ReadOnlySpan<LeadWindowFeatures> features, bool chaoticCandidate)
    {
        var slot = (int)(_added % Ring);
        _start[slot] = startSample;
        _end[slot] = endSample;
        _chaotic[slot] = chaoticCandidate;
        features.CopyTo(_features[slot]);
        _added++;
    }

    /// <summary>No more windows will come: the remaining ones may be decided.</summary>
    public void End() => _ended = true;

    /// <summary>Decides every window whose lookahead is complete, in order.</summary>
    public void Decide(List<QualityWindow> output)
    {
        Span<LeadState> states = stackalloc LeadState[_leads];
        while (_decided < _added && (_ended || _decided + LookaheadWindows < _added))
        {
            var w = _decided;
            var chaotic = ChaoticClosed(w);
            var features = _features[(int)(w % Ring)];
            for (var k = 0; k < _leads; k++)
            {
                var f = features[k];
                states[k] = !f.HasSignal ? f.Base
                    : chaotic && f.LacksQrs(_settings) ? LeadState.Chaotic
                    : UnreadableOpened(k, w) ? LeadState.Unreadable
                    : IsNoisy(f) ? LeadState.Noisy
                    : LeadState.Good;
            }

            var slot = (int)(w % Ring);
            output.Add(new QualityWindow(w, _start[slot], _end[slot], _fs, Reason(states), states));
            _decided++;
        }
    }

    private bool IsNoisy(in LeadWindowFeatures f) =>
        f.ResidualIndex >= _settings.NoisyResidualIndex
        || (!f.IsOrganised(_settings) && (f.SlopeIndex >= _settings.NoisyIndex || f.LowFrequencyIndex >= _settings.NoisyLowFrequencyIndex));

    private static QualityReason Reason(ReadOnlySpan<LeadState> states)
    {
        int missing = 0, flat = 0, saturated = 0, chaotic = 0;
        foreach (var s in states)
        {
            if (s.IsUsable())
            {
                return QualityReason.Ok;
            }

            missing += s == LeadState.Missing ? 1 : 0;
            flat += s == LeadState.Flat ? 1 : 0;
            saturated += s == LeadState.Saturated ? 1 : 0;
            chaotic += s == LeadState.Chaotic ? 1 : 0;
        }

        var present = states.Length - missing;
        return present == 0 ? QualityReason.Missing
            : chaotic > 0 ? QualityReason.ChaoticAllLeads
            : flat == present ? QualityReason.FlatAllLeads
            : saturated == present ? QualityReason.Saturation
            : flat + saturated == present ? QualityReason.LeadOff
            : QualityReason.Noise;
    }

    // Windows before the first repeat the first; after the end of the recording, the last.
    private long Clamp(long i) => i < 0 ? 0 : _ended && i >= _added ? _added - 1 : i;

    private bool UnreadableCandidate(int lead, long i)
    {
        var f = _features[(int)(Clamp(i) % Ring)][lead];
        return f.HasSignal && !f.IsOrganised(_settings)
            && (f.SlopeIndex >= _settings.UnreadableIndex || f.LowFrequencyIndex >= _settings.UnreadableLowFrequencyIndex);
    }

    private bool UnreadableOpened(int lead, long w)
    {
        // An opening keeps only candidates: most windows end here.
        if (!UnreadableCandidate(lead, w))
        {
            return false;
        }

        var r = _unreadableRadius;
        for (var j = w - r; j <= w + r; j++)
        {
            var all = true;
            for (var i = j - r; i <= j + r && all; i++)
            {
                all = UnreadableCandidate(lead, i);
            }

            if (all)
            {
                return true;
            }
        }

        return false;
    }

    private bool ChaoticCandidate(long i) => _chaotic[(int)(Clamp(i) % Ring)];

    // Opening then closing with the same radius.
    private bool ChaoticClosed(long w)
    {
        var r = _chaoticRadius;
        var any = false;
        for (var i = w - 4 * r; i <= w + 4 * r && !any; i++)
        {
            any = ChaoticCandidate(i);
        }

        if (!any)
        {
            return false;
        }

        for (var i = w - r; i <= w + r; i++)
        {
            if (!ChaoticDilatedOpened(i))
            {
                return false;
            }
        }

        return true;
    }

    private bool ChaoticDilatedOpened(long i)
    {
        var r = _chaoticRadius;
        for (var j = i - r; j <= i + r; j++)
        {
            if (ChaoticOpened(j))
            {
                return true;
            }
        }

        return false;
    }

    private bool ChaoticOpened(long j)
    {
        var r = _chaoticRadius;
        for (var a = j - r; a <= j + r; a++)
        {
            var all = true;
            for (var b = a - r; b <= a + r && all; b++)
            {
                all = ChaoticCandidate(b);
            }

            if (all)
            {
                return true;
            }
        }

        return false;
    }
}
