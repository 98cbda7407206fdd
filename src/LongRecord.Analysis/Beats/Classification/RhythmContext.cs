namespace LongRecord.Analysis.Beats.Classification;

/// <summary>
/// The recent rhythm around the beat being classified: the local normal RR (median of the last supraventricular RRs)
/// and an irregularity measure for atrial fibrillation. Fixed memory.
/// </summary>
internal sealed class RhythmContext
{
    private readonly double[] _all;
    private readonly bool[] _ectopic;
    private readonly double[] _normal;
    private readonly double[] _scratch;
    private readonly double[] _regular;
    private readonly double[] _irregular;
    private int _allCount;
    private int _normalCount;

    public RhythmContext(ClassificationSettings settings)
    {
        _all = new double[2 * settings.IrregularityBeats + 3];
        _ectopic = new bool[_all.Length];
        _normal = new double[settings.LocalRrBeats];
        _scratch = new double[Math.Max(_all.Length, _normal.Length)];
        _regular = new double[settings.IrregularityBeats + 3];
        _irregular = new double[settings.IrregularityBeats];
    }

    /// <summary>Every RR in seconds, in order; <paramref name="ectopic"/> when it starts at an ectopic beat.</summary>
    public void AddRr(double rrS, bool ectopic)
    {
        _ectopic[_allCount % _all.Length] = ectopic;
        _all[_allCount++ % _all.Length] = rrS;
    }

    /// <summary>The latest RR ends at an ectopic beat: leave it out of the irregularity measure.</summary>
    public void MarkLatestEctopic()
    {
        if (_allCount > 0)
        {
            _ectopic[(_allCount - 1) % _all.Length] = true;
        }
    }

    /// <summary>An RR between two supraventricular beats, for the local rhythm.</summary>
    public void AddNormalRr(double rrS)
    {
        _normal[_normalCount++ % _normal.Length] = rrS;
    }

    /// <summary>Forgets the local rhythm (a sustained change of rate): it restarts from the latest RRs.</summary>
    public void ResetNormal()
    {
        _normalCount = 0;
    }

    /// <summary>RRs seen so far.</summary>
    public int RrCount => _allCount;

    /// <summary>The <paramref name="back"/>-th last RR (0 = the latest), or NaN.</summary>
    public double Rr(int back) => back < _allCount && back < _all.Length ? _all[(_allCount - 1 - back) % _all.Length] : double.NaN;

    /// <summary>
    /// Median of the last supraventricular RRs; until there are a few, the median of the last RRs; NaN with none.
    /// A median rather than a mean: isolated premature beats and their pauses balance out.
    /// </summary>
    public double LocalNormalRr
    {
        get
        {
            var n = Math.Min(_normalCount, _normal.Length);
            if (n < Math.Min(4, _normal.Length))
            {
                return RecentMedian(9);
            }

            var tmp = _scratch.AsSpan(0, n);
            _normal.AsSpan(0, n).CopyTo(tmp);
            return Median(tmp);
        }
    }

    /// <summary>Median of the last <paramref name="count"/> RRs (all beats), NaN with none.</summary>
    public double RecentMedian(int count)
    {
        var n = Math.Min(Math.Min(count, _allCount), _all.Length);
        if (n == 0)
        {
            return double.NaN;
        }

        var tmp = _scratch.AsSpan(0, n);
        for (var i = 0; i < n; i++)
        {
            tmp[i] = Rr(i);
        }

        return Median(tmp);
    }

    /// <summary>
    /// Median, over the recent RRs that neither start nor end at an ectopic beat, of the least change against any
    /// of the three such RRs before, relative to their mean. With too few such RRs, all RRs when
    /// <paramref name="orAll"/>, else NaN; NaN until enough RRs were seen.
    /// </summary>
    public double Irregularity(bool orAll)
    {
        var need = _regular.Length;
        var got = 0;
        var limit = Math.Min(_allCount, _all.Length);
        for (var back = 0; back < limit && got < need; back++)
        {
            var at = (_allCount - 1 - back) % _all.Length;
            if (!_ectopic[at])
            {
                _regular[got++] = _all[at];
            }
        }

        if (got < need)
        {
            // Mostly ectopic beats lately. Where that may be fibrillation taken for ectopy, judge all RRs; otherwise
            // give no judgement.
            if (!orAll || limit < need)
            {
                return double.NaN;
            }

            got = need;
            for (var back = 0; back < need; back++)
            {
                _regular[back] = Rr(back);
            }
        }

        var n = got - 3;
        double mean = 0;
        for (var i = 0; i < n; i++)
        {
            var rr = _regular[i];
            mean += rr;
            _irregular[i] = Math.Min(Math.Abs(rr - _regular[i + 1]), Math.Min(Math.Abs(rr - _regular[i + 2]), Math.Abs(rr - _regular[i + 3])));
        }

        mean /= n;
        return Median(_irregular.AsSpan(0, n)) / mean;
    }

    private static double Median(Span<double> values) => SmallSort.Median(values);
}
