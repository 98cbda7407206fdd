namespace LongRecord.Analysis.Episodes;

/// <summary>
/// The conditioned ECG of a recording, read on request in short windows (the episode stage reads only the stretches of
/// its candidate episodes). Implemented at the pipeline's edge over the recording reader.
/// </summary>
public interface IEpisodeSignal
{
    /// <summary>Sampling rate of every lead, the recording's <c>f_ref</c>.</summary>
    double SamplingRateHz { get; }

    int Leads { get; }

    /// <summary>Samples per lead.</summary>
    long SampleCount { get; }

    /// <summary>
    /// Fills <paramref name="destination"/> with conditioned samples <paramref name="start"/> … start + count − 1 of
    /// every lead, lead after lead (lead k at k × count), in millivolts; NaN where the recording has none.
    /// </summary>
    void Read(long start, int count, Span<float> destination);
}
