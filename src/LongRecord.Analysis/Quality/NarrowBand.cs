namespace LongRecord.Analysis.Quality;

/// <summary>
/// How close a stretch of conditioned signal is to one sinusoid: the leakage of Kuo and Dillman's "VF filter"
/// (Kuo S, Dillman R. Computer detection of ventricular fibrillation. Computers in Cardiology 1978:347–349; formula as
/// given by Amann A, Tratnig R, Unterkofler K. Reliability of old and new ventricular fibrillation detection
/// algorithms for automated external defibrillators. BioMedical Engineering OnLine 4:60, 2005 — from memory). The half
/// period N is estimated from the mean absolute value and the mean absolute slope; the leakage is
/// Σ|x[i] + x[i−N]| ⁄ Σ(|x[i]| + |x[i−N]|): near 0 for a sinusoid, near 1 for a train of sharp complexes.
/// </summary>
internal static class NarrowBand
{
    /// <summary>Leakage (0…1) and the mean frequency in Hz, fs·Σ|Δx| ⁄ (2π Σ|x|), of <paramref name="x"/>; NaN samples are skipped.</summary>
    public static (double Leakage, double MeanHz) Measure(ReadOnlySpan<float> x, double samplingRateHz)
    {
        double sumAbs = 0, sumSlope = 0;
        for (var i = 1; i < x.Length; i++)
        {
            var d = x[i] - x[i - 1];
            if (float.IsFinite(d))
            {
                sumAbs += Math.Abs(x[i]);
                sumSlope += Math.Abs(d);
            }
        }

        if (sumSlope <= 0 || sumAbs <= 0)
        {
            return (1, 0);
        }

        var meanHz = samplingRateHz * sumSlope / (2 * Math.PI * sumAbs);
        var half = (int)Math.Floor(Math.PI * sumAbs / sumSlope + 0.5);
        if (half < 1 || half >= x.Length)
        {
            return (1, meanHz);
        }

        double num = 0, den = 0;
        for (var i = half; i < x.Length; i++)
        {
            var a = x[i];
            var b = x[i - half];
            if (float.IsFinite(a) && float.IsFinite(b))
            {
                num += Math.Abs(a + b);
                den += Math.Abs(a) + Math.Abs(b);
            }
        }

        return (den > 0 ? num / den : 1, meanHz);
    }
}
