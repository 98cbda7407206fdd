namespace LongRecord.Analysis.Beats.Classification;

/// <summary>
/// Classes from the RR sequence alone, for beats that come without signal (re-analysis of an unlabelled annotation
/// file). A premature beat followed by a full compensatory pause is taken as V (a ventricular beat leaves the sinus
/// node undisturbed, so coupling RR + following RR ≈ 2 sinus cycles); a premature beat whose pause falls short of it
/// as S (an atrial beat resets the sinus node; textbook physiology, from memory); runs of steady premature beats
/// continue as S; during irregularly irregular rhythm beats are N, as prematurity means nothing there. The first few
/// beats, without a rhythm to judge against, are Q. Every beat carries <see cref="BeatFlags.RrOnly"/>. Each beat is
/// decided when the next one arrives, or at <see cref="Flush"/>.
/// </summary>
public sealed class RrOnlyClassifier
{
    // Coupling + following RR at least this fraction of two local cycles is a full compensatory pause; tighter than
    // the signal path's, which has the shape to go on as well (common practice, no source).
    private const double FullCompensatoryRatio = 0.95;
    private const int ContextRrs = 4;

    private readonly double _fs;
    private readonly ClassificationSettings _s;
    private readonly RhythmContext _rhythm;
    private readonly Queue<ClassifiedBeat> _decided = new();
    private long _pending = -1;
    private long _previous = -1;
    private double _pendingRr = double.NaN;
    private BeatClass _previousClass = BeatClass.N;
    private int _run;
    private bool _fibrillation;

    public RrOnlyClassifier(double samplingRateHz, ClassificationSettings? settings = null)
    {
        if (samplingRateHz <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(samplingRateHz), "sampling rate must be positive");
        }

        _fs = samplingRateHz;
        _s = settings ?? ClassificationSettings.Default;
        _rhythm = new RhythmContext(_s);
    }

    /// <summary>Beats decided and not yet taken.</summary>
    public int Ready => _decided.Count;

    /// <summary>Adds the next beat position (sample index), in time order.</summary>
    public void Add(long sample)
    {
        var last = _pending >= 0 ? _pending : _previous;
        if (sample <= last)
        {
            throw new ArgumentException($"beats must come in time order: {sample} after {last}", nameof(sample));
        }

        if (_pending >= 0)
        {
            var rrNext = (sample - _pending) / _fs;
            Decide(rrNext);
            _rhythm.AddRr(rrNext, _previousClass is BeatClass.V or BeatClass.S);
            _previous = _pending;
            _pendingRr = rrNext;
        }

        _pending = sample;
    }

    /// <summary>Takes the oldest decided beat.</summary>
    public bool TryTake(out ClassifiedBeat beat) => _decided.TryDequeue(out beat);

    /// <summary>Ends the sequence: the last beat is decided without a following RR.</summary>
    public void Flush()
    {
        if (_pending >= 0)
        {
            Decide(double.NaN);
            _previous = _pending;
            _pending = -1;
        }
    }

    // The latest RRs swing from beat to beat yet repeat with a period of two or three beats: the median successive
    // change is a large share of the median RR and the median change over that lag a small one (common practice, no
    // source: in AF successive and lagged changes are alike).
    private bool Patterned()
    {
        Span<double> recent = stackalloc double[PatternRrs];
        for (var back = 0; back < PatternRrs; back++)
        {
            recent[back] = _rhythm.Rr(back);
            if (double.IsNaN(recent[back]))
            {
                return false;
            }
        }

        var median = _rhythm.RecentMedian(PatternRrs);
        Span<double> changes = stackalloc double[PatternRrs];
        var successive = MedianChange(recent, 1, changes);
        if (successive < PatternMinSwing * median)
        {
            return false; // hardly irregular beat to beat: no pattern to tell from fibrillation
        }

        for (var lag = 2; lag <= 3; lag++)
        {
            if (MedianChange(recent, lag, changes) <= PatternTolerance * median)
            {
                return true;
            }
        }

        return false;
    }

    private static double MedianChange(ReadOnlySpan<double> rr, int lag, Span<double> scratch)
    {
        var n = rr.Length - lag;
        for (var i = 0; i < n; i++)
        {
            scratch[i] = Math.Abs(rr[i] - rr[i + lag]);
        }

        var c = scratch[..n];
        c.Sort();
        return n % 2 == 1 ? c[n / 2] : 0.5 * (c[n / 2 - 1] + c[n / 2]);
    }

    private const int PatternRrs = 12;
    private const double PatternTolerance = 0.06;

    // Bigeminy swings between a premature coupling and its pause: successive RRs differ by a good share of the cycle.
    private const double PatternMinSwing = 0.2;

    private void Decide(double rrNext)
    {
        var rrPrev = _pendingRr;
        var rrBefore = _rhythm.Rr(1);
        var local = _rhythm.LocalNormalRr;
        BeatClass cls;
        var premature = false;
        if (double.IsNaN(rrPrev) || _rhythm.RrCount < ContextRrs || double.IsNaN(local))
        {
            cls = BeatClass.Q;
        }
        else
        {
            premature = rrPrev < _s.PrematureRatio * local;
            // Fibrillation with hysteresis: entered above the irregularity threshold, left only once the rhythm is
            // clearly regular again, so that a stretch of fibrillation that happens to look calmer stays one.
            var irregularity = _rhythm.Irregularity(orAll: true);
            if (!double.IsNaN(irregularity))
            {
                _fibrillation = _fibrillation ? irregularity > _s.IrregularityWithoutPThreshold : irregularity > _s.IrregularityThreshold;
            }

            // Bigeminy and trigeminy are irregular beat to beat but repeat every second or third RR: regularly
            // irregular, not fibrillation, so their premature beats are still judged as ectopic.
            if (_fibrillation && Patterned())
            {
                _fibrillation = false;
            }

            if (!premature || _fibrillation)
            {
                cls = BeatClass.N;
            }
            else if (_previousClass == BeatClass.S && _run < _s.MaxRunBeats && Math.Abs(rrPrev - rrBefore) <= _s.RunSteadiness * rrBefore)
            {
                cls = BeatClass.S;
            }
            else if (!double.IsNaN(rrNext) && rrPrev + rrNext >= FullCompensatoryRatio * 2 * local)
            {
                cls = BeatClass.V;
            }
            else
            {
                var abrupt = double.IsNaN(rrBefore) || rrPrev < _s.AbruptRatio * rrBefore;
                cls = abrupt ? BeatClass.S : BeatClass.N;
            }
        }

        if (cls is BeatClass.V or BeatClass.S)
        {
            _rhythm.MarkLatestEctopic();
        }

        var supraventricular = cls is BeatClass.N or BeatClass.S && _previousClass is BeatClass.N or BeatClass.S;
        if (supraventricular && !double.IsNaN(rrPrev) && !(cls == BeatClass.S && _previousClass == BeatClass.S))
        {
            _rhythm.AddNormalRr(rrPrev);
        }
        else if (cls == BeatClass.Q && !double.IsNaN(rrPrev))
        {
            // Still learning the rhythm: every RR counts.
            _rhythm.AddNormalRr(rrPrev);
        }

        _run = cls == BeatClass.S ? _run + 1 : 0;
        if (_run >= _s.MaxRunBeats)
        {
            _rhythm.ResetNormal();
        }

        _previousClass = cls;
        var flags = BeatFlags.RrOnly | (premature ? BeatFlags.Premature : BeatFlags.None);
        _decided.Enqueue(new ClassifiedBeat(_pending, cls, -1, flags, float.NaN));
    }
}
