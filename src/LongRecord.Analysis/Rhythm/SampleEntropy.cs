namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// Sample entropy (Richman JS, Moorman JR, Am J Physiol Heart Circ Physiol 2000;278:H2039-H2049) and the coefficient
/// of sample entropy (Lake DE, Moorman JR, Am J Physiol Heart Circ Physiol 2011;300:H319-H325).
/// </summary>
public static class SampleEntropy
{
    /// <summary>
    /// −ln(A/B): B counts pairs of templates of length m that match (Chebyshev distance ≤ r), A those that still match
    /// at length m + 1, over the N − m template starts shared by both lengths, self-matches excluded. NaN when A or B
    /// is zero (undefined).
    /// </summary>
    public static double Compute(ReadOnlySpan<double> x, int m, double r)
    {
        var n = x.Length;
        long a = 0, b = 0;
        for (var i = 0; i < n - m; i++)
        {
            for (var j = i + 1; j < n - m; j++)
            {
                var k = 0;
                while (k < m && Math.Abs(x[i + k] - x[j + k]) <= r)
                {
                    k++;
                }

                if (k == m)
                {
                    b++;
                    if (Math.Abs(x[i + m] - x[j + m]) <= r)
                    {
                        a++;
                    }
                }
            }
        }

        return a > 0 && b > 0 ? -Math.Log((double)a / b) : double.NaN;
    }

    /// <summary>
    /// Coefficient of sample entropy: SampEn + ln(2r) − ln(mean), with r and the mean RR in the same unit (the
    /// result does not depend on which).
    /// </summary>
    public static double Coefficient(double sampleEntropy, double r, double meanRr) =>
        sampleEntropy + Math.Log(2 * r) - Math.Log(meanRr);
}
