namespace LongRecord.Analysis.Beats.Classification;

/// <summary>
/// The run of premature supraventricular beats in progress: the rhythm it is judged against (the local RR when it
/// began) and its last few beats, to tell an ectopic atrial rhythm (its RRs change little from beat to beat, P waves
/// often visible) from the onset of atrial fibrillation taken for one (RRs irregularly irregular, no P waves).
/// </summary>
internal sealed class SupraventricularRun
{
    private const int Kept = 8;

    private readonly double[] _rr = new double[Kept];
    private readonly sbyte[] _p = new sbyte[Kept];
    private readonly double[] _consistency = new double[Kept];
    private readonly double[] _scratch = new double[Kept];

    /// <summary>Beats in the run so far (0 when none is in progress).</summary>
    public int Length { get; private set; }

    /// <summary>The run looks like atrial fibrillation setting in: its beats are not taken as ectopic for now.</summary>
    public bool Suspended { get; set; }

    /// <summary>The local RR before the run began, s.</summary>
    public double ReferenceRr { get; private set; } = double.NaN;

    private int HeldBeats => Math.Min(Length, Kept);

    public void Start(double referenceRr)
    {
        Length = 0;
        Suspended = false;
        ReferenceRr = referenceRr;
    }

    public void Add(double rrS, sbyte pWave, double atrialToPrevious)
    {
        var at = Length % Kept;
        _consistency[at] = atrialToPrevious;
        _rr[at] = rrS;
        _p[at] = pWave;
        Length++;
    }

    public void End()
    {
        Length = 0;
        Suspended = false;
        ReferenceRr = double.NaN;
    }

    // Ring position of the back-th last beat held (0 = the latest).
    private int Held(int back) => (Length - 1 - back) % Kept;

    /// <summary>
    /// Median change between successive RRs of the run, including <paramref name="nextRrS"/>, relative to their
    /// mean; NaN with fewer than three changes. The coupling RR of the run's first beat is left out: an ectopic
    /// focus often warms up over its first beats.
    /// </summary>
    public double Irregularity(double nextRrS)
    {
        var n = Math.Min(Length - 1, Kept);
        if (n < 3)
        {
            return double.NaN;
        }

        var previous = nextRrS;
        for (var back = 0; back < n; back++)
        {
            var rr = _rr[Held(back)];
            _scratch[back] = Math.Abs(previous - rr) / (0.5 * (previous + rr));
            previous = rr;
        }

        return Median(_scratch.AsSpan(0, n));
    }

    /// <summary>
    /// Median likeness of each beat's pre-QRS segment to the one before, over the held beats after the first and
    /// <paramref name="nextToPrevious"/>: high when one focus fires at a steady rate (its P waves and the T waves
    /// they ride on repeat), low in fibrillation. NaN when none is known.
    /// </summary>
    public double Consistency(double nextToPrevious)
    {
        var n = 0;
        if (!double.IsNaN(nextToPrevious))
        {
            _scratch[n++] = nextToPrevious;
        }

        for (var back = 0; back < Math.Min(Length - 1, Kept - 1); back++)
        {
            var c = _consistency[Held(back)];
            if (!double.IsNaN(c))
            {
                _scratch[n++] = c;
            }
        }

        return n == 0 ? double.NaN : Median(_scratch.AsSpan(0, n));
    }

    /// <summary>Share of the held beats, with <paramref name="nextPWave"/>, on which delineation found a P wave; NaN when none was judged.</summary>
    public double PPresence(sbyte nextPWave)
    {
        int judged = 0, found = 0;
        for (var back = -1; back < HeldBeats; back++)
        {
            var p = back < 0 ? nextPWave : _p[Held(back)];
            if (p >= 0)
            {
                judged++;
                found += p;
            }
        }

        return judged == 0 ? double.NaN : (double)found / judged;
    }

    private static double Median(Span<double> values)
    {
        values.Sort();
        var n = values.Length;
        return n % 2 == 1 ? values[n / 2] : 0.5 * (values[n / 2 - 1] + values[n / 2]);
    }
}
