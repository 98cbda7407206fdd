namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>The QRS as one lead shows it: boundary indices (−1 = not found) and the figures the multilead rules weigh.</summary>
internal struct LeadQrs
{
    public int Onset;
    public int Offset;

    /// <summary>Onset and offset with the threshold crossing interpolated between samples.</summary>
    public float OnsetAt;
    public float OffsetAt;

    /// <summary>Largest absolute slope of the QRS, mV/s.</summary>
    public float PeakSlope;

    /// <summary>Typical slope outside the QRS (the noise floor the thresholds respect), mV/s.</summary>
    public float NoiseSlope;

    /// <summary>Peak-to-peak amplitude of the low-passed QRS, mV.</summary>
    public float Amplitude;

    public bool Usable;

    public readonly float Snr => NoiseSlope > 0 ? PeakSlope / NoiseSlope : PeakSlope > 0 ? float.MaxValue : 0;
}
