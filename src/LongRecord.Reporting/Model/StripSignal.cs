namespace LongRecord.Reporting.Model;

/// <summary>One window of signal: every lead in millivolts (NaN where not recorded), and the beats inside it.</summary>
public sealed class StripSignal
{
    public StripSignal(int leads, int capacity)
    {
        Leads = leads;
        Samples = new float[leads * capacity];
    }

    public int Leads { get; }

    /// <summary>Samples per lead in this window.</summary>
    public int Count { get; set; }

    public double StartS { get; set; }

    public double SamplingRateHz { get; set; }

    /// <summary>Lead after lead: lead k's samples at k × <see cref="Count"/>.</summary>
    public float[] Samples { get; private set; }

    public List<StripBeat> Beats { get; } = [];

    public ReadOnlySpan<float> Lead(int k) => Samples.AsSpan(k * Count, Count);

    /// <summary>Makes room for <paramref name="count"/> samples per lead.</summary>
    public void Reset(double startS, double rateHz, int count)
    {
        if (Samples.Length < Leads * count)
        {
            Samples = new float[Leads * count];
        }

        StartS = startS;
        SamplingRateHz = rateHz;
        Count = count;
        Beats.Clear();
    }
}
