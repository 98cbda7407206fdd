namespace LongRecord.Synthesis.Model;

/// <summary>Amplitude of one wave in each lead view, in mV.</summary>
internal readonly record struct ViewAmplitudes(double II, double V1, double V5)
{
    public double For(LeadView view) => view switch
    {
        LeadView.II => II,
        LeadView.V1 => V1,
        _ => V5,
    };
}

/// <summary>
/// One Gaussian component of a beat: amplitude × exp(−(t − centre)² / (2 width²)).
/// <paramref name="CenterS"/> is relative to the beat's reference point (the R wave centre for QRS and T,
/// the P wave's own peak for P components) at an RR of 1 s.
/// </summary>
internal readonly record struct GaussianWave(string Name, double CenterS, double WidthS, ViewAmplitudes Amplitude);
