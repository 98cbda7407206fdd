namespace LongRecord.Analysis.Quality;

/// <summary>
/// Last step before windows leave the monitor: a short run of noise windows (at most
/// <see cref="QualitySettings.ChaoticBridgeWindows"/>) that touches a chaotic run takes the chaotic reason. Fibrillation
/// passes through stretches that look like plain noise (MITDB 207's long flutter stretch has several); they belong to
/// the same episode and must reach the episodes stage as possible fibrillation, not as noise.
/// </summary>
internal sealed class ChaoticBridge
{
    private readonly int _maxRun;
    private readonly Queue<QualityWindow> _held = new();
    private bool _afterChaotic;
    private bool _runTooLong;

    public ChaoticBridge(int maxRunWindows) => _maxRun = maxRunWindows;

    /// <summary>Windows held back while it is open whether a noise run touches fibrillation.</summary>
    public int HeldWindows => _held.Count;

    public void Add(in QualityWindow window, List<QualityWindow> output)
    {
        if (window.Reason == QualityReason.Noise)
        {
            if (_runTooLong)
            {
                output.Add(window);
                return;
            }

            _held.Enqueue(window);
            if (_held.Count > _maxRun)
            {
                Release(output, relabel: false);
                _runTooLong = true;
                _afterChaotic = false;
            }

            return;
        }

        var chaotic = window.Reason == QualityReason.ChaoticAllLeads;
        Release(output, relabel: chaotic || _afterChaotic);
        output.Add(window);
        _afterChaotic = chaotic;
        _runTooLong = false;
    }

    public void End(List<QualityWindow> output) => Release(output, relabel: _afterChaotic);

    private void Release(List<QualityWindow> output, bool relabel)
    {
        Span<LeadState> states = stackalloc LeadState[QualityWindow.MaxLeads];
        while (_held.Count > 0)
        {
            var w = _held.Dequeue();
            if (!relabel)
            {
                output.Add(w);
                continue;
            }

            var leadStates = states[..w.LeadCount];
            for (var k = 0; k < w.LeadCount; k++)
            {
                var s = w.State(k);
                leadStates[k] = s == LeadState.Unreadable ? LeadState.Chaotic : s;
            }

            output.Add(new QualityWindow(w.Index, w.StartSample, w.EndSample, w.StartS, w.EndS, QualityReason.ChaoticAllLeads, leadStates));
        }
    }
}
