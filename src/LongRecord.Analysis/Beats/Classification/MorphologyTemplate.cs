namespace LongRecord.Analysis.Beats.Classification;

/// <summary>One morphology cluster of a recording: the running mean of its beats' QRS segments and their statistics.</summary>
internal sealed class MorphologyTemplate
{
    public MorphologyTemplate(int leads, int segment, int atrial)
    {
        Atrial = new float[leads * atrial];
        Mean = new float[leads * segment];
        LeadEnergy = new double[leads];
    }

    public short Id { get; set; }

    /// <summary>Zero-mean segment per lead, lead-major (lead k at k × segment).</summary>
    public float[] Mean { get; }

    public double[] LeadEnergy { get; }

    /// <summary>Running mean of the pre-QRS segment of the on-time beats (the sinus P wave when there is one).</summary>
    public float[] Atrial { get; }

    public long AtrialCount { get; set; }

    public double Energy { get; set; }

    public long Count { get; set; }

    /// <summary>Beats joined, decayed with the number of beats seen since (so that old clusters fade).</summary>
    public double Weight { get; set; }

    /// <summary>Like <see cref="Weight"/>, counting only beats that came on time (not premature).</summary>
    public double OnTimeWeight { get; set; }

    /// <summary>Like <see cref="Weight"/>, counting only premature beats.</summary>
    public double PrematureWeight { get; set; }

    /// <summary>Like <see cref="Weight"/>, counting only beats decided V.</summary>
    public double VentricularWeight { get; set; }

    /// <summary>Running mean of the beats' slope-energy spread, ms.</summary>
    public double SpreadMs { get; set; }

    /// <summary>Running mean of the caller's QRS widths, ms, or NaN when none was given.</summary>
    public double WidthMs { get; set; } = double.NaN;

    /// <summary>Running lower quartile of the caller's QRS widths, ms (stochastic approximation), or NaN when none was given.</summary>
    public double WidthLowerQuartileMs { get; set; } = double.NaN;

    /// <summary>Beats whose QRS width the caller gave.</summary>
    public long WidthCount { get; set; }

    public bool InUse { get; set; }

    /// <summary>Changes whenever the mean does (a number never given twice in one template set).</summary>
    public long Version { get; set; }

    /// <summary>The template's beat count when its mean complex was last delimited (<see cref="TemplateQrs"/>); 0 never.</summary>
    public long QrsMeasuredAt { get; set; }

    /// <summary>QRS onset and offset of the mean complex, indices into the segment (−1 when not found), and its width in ms.</summary>
    public int QrsOnset { get; set; } = -1;

    public int QrsOffset { get; set; } = -1;

    public float QrsMs { get; set; } = float.NaN;

    public void Decay(double factor)
    {
        Weight *= factor;
        OnTimeWeight *= factor;
        PrematureWeight *= factor;
        VentricularWeight *= factor;
    }

    public void RecomputeEnergy(int leads, int segment)
    {
        double total = 0;
        for (var k = 0; k < leads; k++)
        {
            double e = 0;
            var lead = Mean.AsSpan(k * segment, segment);
            foreach (var v in lead)
            {
                e += v * v;
            }

            LeadEnergy[k] = e;
            total += e;
        }

        Energy = total;
    }
}
