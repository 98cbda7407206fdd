namespace LongRecord.Analysis.Conditioning;

/// <summary>
/// Streaming conditioning of all the leads of one recording, in lead-major blocks: every lead exactly as its own
/// <see cref="EcgConditioner"/> would condition it (the same samples, bit for bit), with two leads' filter cascades run
/// together in the lanes of one vector, which halves the time for two leads (see
/// <see cref="BiquadCascade.ProcessWith"/>).
/// </summary>
public sealed class LeadSetConditioner
{
    private readonly EcgConditioner[] _leads;

    public LeadSetConditioner(double samplingRateHz, int leads, ConditioningSettings? settings = null)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(leads);
        _leads = new EcgConditioner[leads];
        for (var k = 0; k < leads; k++)
        {
            _leads[k] = new EcgConditioner(samplingRateHz, settings);
        }
    }

    public int Leads => _leads.Length;

    /// <summary>Conditions <paramref name="count"/> samples of every lead in place, lead-major (lead k at k × count).</summary>
    public void Process(Span<float> leadMajor, int count)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        if (leadMajor.Length < (long)_leads.Length * count)
        {
            throw new ArgumentException($"the block needs {_leads.Length} × {count} samples", nameof(leadMajor));
        }

        var k = 0;
        for (; k + 1 < _leads.Length; k += 2)
        {
            var first = leadMajor.Slice(k * count, count);
            var second = leadMajor.Slice((k + 1) * count, count);
            var firstGaps = _leads[k].HoldGaps(first);
            var secondGaps = _leads[k + 1].HoldGaps(second);
            _leads[k].Filter.ProcessWith(_leads[k + 1].Filter, first, second);
            EcgConditioner.RestoreGaps(first, firstGaps);
            EcgConditioner.RestoreGaps(second, secondGaps);
        }

        if (k < _leads.Length)
        {
            _leads[k].Process(leadMajor.Slice(k * count, count));
        }
    }
}
