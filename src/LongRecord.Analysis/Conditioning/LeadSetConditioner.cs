namespace LongRecord.Analysis.Conditioning;

/// <summary>
/// Streaming conditioning of all the leads of one recording, in lead-major blocks: every lead exactly as its own
/// <see cref="EcgConditioner"/> would condition it (the same samples, bit for bit), with the leads' filter cascades run
/// together in the lanes of one vector (<see cref="BiquadCascade.ProcessLeads"/>: four at a time, so three or four
/// leads cost what one costs alone).
/// </summary>
public sealed class LeadSetConditioner
{
    private readonly EcgConditioner[] _leads;
    private readonly BiquadCascade[] _filters;
    private readonly int[] _gapCounts;

    public LeadSetConditioner(double samplingRateHz, int leads, ConditioningSettings? settings = null)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(leads);
        _leads = new EcgConditioner[leads];
        _filters = new BiquadCascade[leads];
        _gapCounts = new int[leads];
        for (var k = 0; k < leads; k++)
        {
            _leads[k] = new EcgConditioner(samplingRateHz, settings);
            _filters[k] = _leads[k].Filter;
        }
    }

    public int Leads => _leads.Length;

    /// <summary>Lead <paramref name="lead"/>'s filter cascade, for tests that compare its state with a lead run alone.</summary>
    internal BiquadCascade LeadFilter(int lead) => _filters[lead];

    /// <summary>Conditions <paramref name="count"/> samples of every lead in place, lead-major (lead k at k × count).</summary>
    public void Process(Span<float> leadMajor, int count)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        if (leadMajor.Length < (long)_leads.Length * count)
        {
            throw new ArgumentException($"the block needs {_leads.Length} × {count} samples", nameof(leadMajor));
        }

        // Every lead's gaps held, all the cascades run together in vector lanes, the gaps restored.
        var gapCounts = _gapCounts;
        for (var k = 0; k < _leads.Length; k++)
        {
            gapCounts[k] = _leads[k].HoldGaps(leadMajor.Slice(k * count, count)).Length;
        }

        BiquadCascade.ProcessLeads(_filters, leadMajor, count);
        for (var k = 0; k < _leads.Length; k++)
        {
            EcgConditioner.RestoreGaps(leadMajor.Slice(k * count, count), _leads[k].HeldGaps(gapCounts[k]));
        }
    }
}
