namespace LongRecord.Analysis.Beats.Classification;

/// <summary>
/// What noise alone does to a beat's shape comparison, judged from the beat's neighbourhood.
/// <para>
/// A beat of a template's very shape still leaves a residual against it: its noise. That residual (the beat's
/// segment energy the template's shape cannot explain, amplitude fitted) is measured on every beat against the template
/// it resembles most, and set against the beat's own noise level (the mean absolute second difference outside its QRS).
/// Their ratio depends on the noise's spectrum — white noise raises the second difference far more than the low-pass
/// muscle noise of real recordings does (on the noise stress test's muscle noise record, Moody et al. 1984, a 240 ms
/// window's zero-mean noise energy is some 25 times what white noise of the same mean absolute second difference would
/// carry; measured once, both channels, median over the record) — so it is learned from
/// the recent beats rather than assumed: its median over the last <see cref="ClassificationSettings.NoiseFloorBeats"/>
/// beats (the median, so that ectopic beats, whose residual against a template of another shape is large, do not count
/// as noise while they are the fewer; once they have a template of their own, their residual against it is noise too).
/// A beat's expected noise residual is that ratio times its own squared noise level, so a beat in a noise burst is
/// judged by its own noise, at the calibration its neighbours give.
/// </para>
/// <para>
/// From that residual the correlation a beat of the same shape would reach through its noise follows as
/// √(1 − residual ÷ beat energy); dividing an observed correlation by it is the correction for attenuation (Spearman,
/// "The proof and measurement of association between two things", Am J Psychol 15, 1904; the reliability here being the
/// share of the beat's energy that is not noise). The classifier's correlation thresholds were set on clean beats,
/// whose same-shape correlation is itself below one (<see cref="ClassificationSettings.CleanShapeCorrelation"/>);
/// a noisier beat's correlation is scaled up to what it would be at that clean level, and a cleaner one is left as it
/// is, so decisions in clean recordings do not change.
/// </para>
/// </summary>
internal sealed class NoiseFloor
{
    private readonly double[] _ratios;
    private readonly double[] _sorted;
    private readonly double _clean;
    private int _count;
    private int _next;
    private double _ratio = double.NaN;

    public NoiseFloor(ClassificationSettings settings)
    {
        _ratios = new double[settings.NoiseFloorBeats];
        _sorted = new double[settings.NoiseFloorBeats];
        _clean = settings.CleanShapeCorrelation;
    }

    /// <summary>Segment energy (summed over leads) that noise alone is expected to leave in a beat of this noise level; 0 before any beat was measured.</summary>
    public double ResidualFor(double noiseLevel) => double.IsNaN(_ratio) ? 0 : _ratio * noiseLevel * noiseLevel;

    /// <summary>Counts one beat: its residual energy against the template it resembles most, and its noise level.</summary>
    public void Add(double residualEnergy, double noiseLevel)
    {
        if (!(noiseLevel > 0) || double.IsNaN(residualEnergy) || residualEnergy < 0)
        {
            return;
        }

        _ratios[_next] = residualEnergy / (noiseLevel * noiseLevel);
        _next = (_next + 1) % _ratios.Length;
        _count = Math.Min(_count + 1, _ratios.Length);
        _ratio = Median();
    }

    /// <summary>
    /// The factor that brings a correlation through noise to the clean level: 1 when noise alone would still let a beat
    /// of the same shape correlate at <see cref="ClassificationSettings.CleanShapeCorrelation"/> or better, otherwise
    /// that correlation over the one noise allows (amplitudes are divided by it: noise adds energy too).
    /// </summary>
    public double Correction(double noiseResidual, double beatEnergy)
    {
        var floor = SameShapeCorrelation(noiseResidual, beatEnergy);
        return floor >= _clean ? 1 : _clean / Math.Max(floor, 1e-3);
    }

    /// <summary>The correlation noise alone leaves between a beat of this energy and a noise-free template of its very shape.</summary>
    public static double SameShapeCorrelation(double noiseResidual, double beatEnergy) =>
        beatEnergy > 0 ? Math.Sqrt(Math.Max(0, 1 - noiseResidual / beatEnergy)) : 0;

    private double Median()
    {
        // The lower median of at most a few dozen values, once per beat.
        var n = _count;
        var sorted = _sorted.AsSpan(0, n);
        _ratios.AsSpan(0, n).CopyTo(sorted);
        SmallSort.Sort(sorted);
        return _sorted[(n - 1) / 2];
    }
}
