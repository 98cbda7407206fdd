namespace LongRecord.Synthesis.Model;

/// <summary>
/// The wave catalogue resolved for one recording's leads, with the truth fiducials each QRS shape implies.
/// <para>
/// Truth definitions (ours): the R time of a beat is its fiducial point, the time of the largest absolute excursion of
/// the Q+R+S Gaussian sum in the recording's first lead. QRS onset (offset) is the earliest (latest) time, over all
/// leads, at which that lead's Q+R+S sum departs from baseline by at least <see cref="QrsEdgeFraction"/> of its own
/// largest absolute excursion (leads whose QRS is under 0.05 mV are ignored). T end is where the T Gaussian has fallen
/// to the same fraction of its peak after the peak: centre + √(2 ln 50) × width. A delineator working on the signal
/// should see the QRS onset/offset as the first/last point, in the lead that starts earliest/ends latest, where the
/// slope or the excursion from the isoelectric level stops being negligible; a threshold of about 10 % of the QRS's
/// peak slope on a Gaussian edge falls within 1–2 ms of the 2 % amplitude point.
/// </para>
/// </summary>
internal sealed class LeadMorphologies
{
    /// <summary>Fraction of a wave's largest excursion that marks its edge (ours).</summary>
    public const double QrsEdgeFraction = 0.02;

    /// <summary>√(2 ln(1 / 0.02)): distance in widths from a Gaussian's centre to its 2 % point.</summary>
    public static readonly double EdgeWidths = Math.Sqrt(2.0 * Math.Log(1.0 / QrsEdgeFraction));

    public LeadMorphologies(IReadOnlyList<LeadView> views)
    {
        Views = views;
        var n = WaveCatalogue.Morphologies.Count;
        FiducialShiftS = new double[n];
        QrsOnsetS = new double[n];
        QrsOffsetS = new double[n];
        QrsPeakToPeakMv = new double[n][];
        for (var m = 0; m < n; m++)
        {
            Resolve(m);
        }
    }

    public IReadOnlyList<LeadView> Views { get; }

    /// <summary>Fiducial (truth R time) minus the R wave centre, per morphology.</summary>
    public double[] FiducialShiftS { get; }

    /// <summary>QRS onset relative to the fiducial, per morphology (negative).</summary>
    public double[] QrsOnsetS { get; }

    /// <summary>QRS offset relative to the fiducial, per morphology.</summary>
    public double[] QrsOffsetS { get; }

    /// <summary>Peak-to-peak amplitude of the Q+R+S sum, per morphology and lead, mV (before per-beat scaling).</summary>
    public double[][] QrsPeakToPeakMv { get; }

    /// <summary>T end relative to the fiducial for morphology <paramref name="m"/> ending an RR of <paramref name="rrS"/>.</summary>
    public double TEndS(int m, double rrS)
    {
        var s = WaveCatalogue.TScale(rrS);
        var end = double.NegativeInfinity;
        foreach (var t in WaveCatalogue.Morphologies[m].T)
        {
            end = Math.Max(end, t.CenterS * s + EdgeWidths * t.WidthS * s);
        }

        return end - FiducialShiftS[m];
    }

    private void Resolve(int m)
    {
        const double stepS = 0.00002;
        const double spanS = 0.25;
        var morph = WaveCatalogue.Morphologies[m];
        var steps = (int)(2 * spanS / stepS) + 1;

        var onset = double.PositiveInfinity;
        var offset = double.NegativeInfinity;
        var fiducial = 0.0;
        QrsPeakToPeakMv[m] = new double[Views.Count];
        for (var lead = 0; lead < Views.Count; lead++)
        {
            var view = Views[lead];
            double max = double.NegativeInfinity, min = double.PositiveInfinity, absMax = 0, absMaxAt = 0;
            for (var i = 0; i < steps; i++)
            {
                var t = -spanS + i * stepS;
                var v = QrsValue(morph, view, t);
                max = Math.Max(max, v);
                min = Math.Min(min, v);
                if (Math.Abs(v) > absMax)
                {
                    absMax = Math.Abs(v);
                    absMaxAt = t;
                }
            }

            QrsPeakToPeakMv[m][lead] = max - min;
            if (lead == 0)
            {
                fiducial = absMaxAt;
            }

            if (absMax < 0.05)
            {
                continue;
            }

            var threshold = QrsEdgeFraction * absMax;
            for (var i = 0; i < steps; i++)
            {
                var t = -spanS + i * stepS;
                if (Math.Abs(QrsValue(morph, view, t)) >= threshold)
                {
                    onset = Math.Min(onset, t);
                    break;
                }
            }

            for (var i = steps - 1; i >= 0; i--)
            {
                var t = -spanS + i * stepS;
                if (Math.Abs(QrsValue(morph, view, t)) >= threshold)
                {
                    offset = Math.Max(offset, t);
                    break;
                }
            }
        }

        FiducialShiftS[m] = fiducial;
        QrsOnsetS[m] = onset - fiducial;
        QrsOffsetS[m] = offset - fiducial;
    }

    private static double QrsValue(BeatMorphology morph, LeadView view, double t)
    {
        var sum = 0.0;
        foreach (var w in morph.Qrs)
        {
            var d = (t - w.CenterS) / w.WidthS;
            sum += w.Amplitude.For(view) * Math.Exp(-0.5 * d * d);
        }

        return sum;
    }
}
