namespace LongRecord.Analysis.Episodes;

/// <summary>A stretch of conditioned signal, every lead, read for one candidate.</summary>
internal sealed class SignalWindow
{
    private readonly float[] _data;

    private SignalWindow(long startSample, int count, int leads, double rateHz, float[] data)
    {
        StartSample = startSample;
        Count = count;
        Leads = leads;
        RateHz = rateHz;
        _data = data;
    }

    public long StartSample { get; }
    public int Count { get; }
    public int Leads { get; }
    public double RateHz { get; }

    public long EndSample => StartSample + Count;

    public ReadOnlySpan<float> Lead(int k) => _data.AsSpan(k * Count, Count);

    /// <summary>Reads seconds <paramref name="fromS"/> … <paramref name="toS"/> (clipped to the recording); null when nothing is left.</summary>
    public static SignalWindow? Read(IEpisodeSignal signal, double fromS, double toS)
    {
        var fs = signal.SamplingRateHz;
        var start = Math.Max(0, (long)Math.Floor(fromS * fs));
        var end = Math.Min(signal.SampleCount, (long)Math.Ceiling(toS * fs));
        if (end - start < fs)
        {
            return null;
        }

        var count = (int)(end - start);
        var data = new float[count * signal.Leads];
        signal.Read(start, count, data);
        return new SignalWindow(start, count, signal.Leads, fs, data);
    }

    /// <summary>True when samples <paramref name="from"/> … <paramref name="to"/> (absolute) all lie inside the window.</summary>
    public bool Holds(long from, long to) => from >= StartSample && to < EndSample;

    /// <summary>Index in the window of absolute sample <paramref name="sample"/>.</summary>
    public int At(long sample) => (int)(sample - StartSample);
}
