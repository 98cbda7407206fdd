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

    /// <summary>High-frequency slope noise of the lead (what the 25 Hz band holds beyond the 15 Hz band), mV/s.</summary>
    public float NoiseSlope;

    /// <summary>Typical slope of what the lead shows outside the QRS (the floor the boundary thresholds respect), mV/s.</summary>
    public float ActivitySlope;

    /// <summary>Peak-to-peak amplitude of the low-passed QRS, mV.</summary>
    public float Amplitude;

    /// <summary>Slope peaks of the first and the last wave of the QRS (the waves the onset and the end are measured from), mV/s.</summary>
    public float FirstSlope;
    public float LastSlope;

    public bool Usable;

    public readonly float Snr => NoiseSlope > 0 ? PeakSlope / NoiseSlope : PeakSlope > 0 ? float.MaxValue : 0;
}
