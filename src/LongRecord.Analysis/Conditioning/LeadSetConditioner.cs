namespace LongRecord.Analysis.Conditioning;

/// <summary>
/// Streaming conditioning of all the leads of one recording, in lead-major blocks: every lead exactly as its own
/// <see cref="EcgConditioner"/> would condition it (the same samples, bit for bit), with the leads' filter cascades run
/// together in the lanes of one vector: four at a time (three or four leads cost what one costs alone; see
/// <see cref="BiquadCascade.ProcessFour"/>), two for a group of two (<see cref="BiquadCascade.ProcessWith"/>).
/// </summary>
public sealed class LeadSetConditioner
{
    private readonly EcgConditioner[] _leads;
    private readonly BiquadCascade[] _filters;

    public LeadSetConditioner(double samplingRateHz, int leads, ConditioningSettings? settings = null)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(leads);
        _leads = new EcgConditioner[leads];
        _filters = new BiquadCascade[leads];
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

        // Groups of four leads, then the rest: three as four, two as a pair, one alone.
        Span<int> gapCounts = stackalloc int[4];
        for (var k = 0; k < _leads.Length; k += 4)
        {
            var group = Math.Min(4, _leads.Length - k);
            if (group == 1)
            {
                _leads[k].Process(leadMajor.Slice(k * count, count));
                continue;
            }

            for (var j = 0; j < group; j++)
            {
                gapCounts[j] = _leads[k + j].HoldGaps(leadMajor.Slice((k + j) * count, count)).Length;
            }

            var block = leadMajor.Slice(k * count, group * count);
            if (group == 2)
            {
                _filters[k].ProcessWith(_filters[k + 1], block[..count], block.Slice(count, count));
            }
            else
            {
                BiquadCascade.ProcessFour(_filters.AsSpan(k, group), block, count);
            }

            for (var j = 0; j < group; j++)
            {
                EcgConditioner.RestoreGaps(block.Slice(j * count, count), _leads[k + j].HeldGaps(gapCounts[j]));
            }
        }
    }
}
