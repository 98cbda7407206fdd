namespace LongRecord.Analysis.Beats.Classification;

/// <summary>
/// The rules that turn a beat's shape (against the recording's normal template) and its timing (against the local
/// rhythm) into an EC57 class.
/// <list type="bullet">
/// <item>V: a shape unlike the normal one (correlation below 0.9, or wider) and not narrower than it, which is
/// premature and either clearly unlike (below 0.7), wide, or followed by a full compensatory pause; or, on time,
/// clearly unlike and either wide or from a cluster whose beats are mostly premature.</item>
/// <item>S: a normal-like shape, premature against the local rhythm and abruptly shorter than the RR before, with a
/// pre-QRS segment unlike the sinus one (ectopic P, or P hidden in the T wave), followed by a longer RR (the pause)
/// or by more premature beats (a run); runs continue while the RR stays short and steady. Never during irregularly
/// irregular rhythm without sinus P waves (atrial fibrillation): conducted beats there are N.</item>
/// <item>Q: no usable signal, a noisy window, or an on-time beat of a shape that matches no template.</item>
/// </list>
/// </summary>
internal sealed class BeatDecision
{
    private readonly ClassificationSettings _s;
    private readonly RhythmContext _rhythm;
    private int _run;
    private double _atrialSimilarity = 1;

    public BeatDecision(ClassificationSettings settings, RhythmContext rhythm)
    {
        _s = settings;
        _rhythm = rhythm;
    }

    public BeatClass PreviousClass { get; private set; } = BeatClass.N;

    public (BeatClass Class, BeatFlags Flags) Decide(in BeatClassifier.Pending beat, double rrNextS)
    {
        var local = _rhythm.LocalNormalRr;
        var rrPrev = beat.RrPrevS;
        var rrBefore = _rhythm.Rr(1);
        var premature = !double.IsNaN(local) && !double.IsNaN(rrPrev) && rrPrev < _s.PrematureRatio * local;
        var flags = premature ? BeatFlags.Premature : BeatFlags.None;

        BeatClass cls;
        if (!beat.Valid || beat.Noise > _s.NoiseLimit)
        {
            cls = BeatClass.Q;
        }
        else
        {
            var narrower = beat.ExtraWidthMs < -_s.NarrowerMs;
            var normalShape = beat.IsNormalTemplate || (beat.CorrelationToNormal >= _s.NormalCorrelation && beat.ExtraWidthMs < _s.WideExtraMs);
            var clearlyDifferent = beat.CorrelationToNormal < _s.DifferentCorrelation;
            var wide = beat.ExtraWidthMs >= _s.WideExtraMs;
            var compensatory = !double.IsNaN(rrNextS) && !double.IsNaN(local) && rrPrev + rrNextS >= _s.CompensatoryRatio * 2 * local;
            var ventricular = !normalShape && !narrower && (premature
                ? clearlyDifferent || wide || compensatory
                : clearlyDifferent && (wide || beat.TemplatePrematureShare >= 0.5));
            if (ventricular)
            {
                // An on-time beat of a shape not seen before is more often artefact than ectopy.
                cls = beat.NewShape && !premature ? BeatClass.Q : BeatClass.V;
            }
            else
            {
                cls = Supraventricular(rrPrev, rrBefore, rrNextS, local, premature, beat) ? BeatClass.S : BeatClass.N;
                if (!premature && !double.IsNaN(beat.AtrialCorrelation))
                {
                    _atrialSimilarity += (beat.AtrialCorrelation - _atrialSimilarity) / 16;
                }
            }
        }

        Follow(cls, rrPrev);
        return (cls, flags);
    }

    private bool Supraventricular(double rrPrev, double rrBefore, double rrNext, double local, bool premature, in BeatClassifier.Pending beat)
    {
        if (!premature || Fibrillation(beat.PWave))
        {
            return false;
        }

        if (PreviousClass == BeatClass.S)
        {
            // Inside a run: the RR stays short against the rhythm before the run, and steady.
            return _run < _s.MaxRunBeats && Math.Abs(rrPrev - rrBefore) <= _s.RunSteadiness * rrBefore;
        }

        var abrupt = double.IsNaN(rrBefore) || rrPrev < _s.AbruptRatio * rrBefore;
        var pauseOrRun = double.IsNaN(rrNext) || rrNext >= _s.PauseRatio * rrPrev || rrNext < _s.PrematureRatio * local;

        // A pre-QRS segment just like the sinus one means a sinus P wave: an early sinus beat (after a block, in
        // sinus arrhythmia), not an ectopic atrial one, whose P differs or hides in the T wave before.
        var sinusP = beat.AtrialCorrelation >= _s.SinusAtrialCorrelation;
        return abrupt && pauseOrRun && !sinusP;
    }

    private bool Fibrillation(sbyte pWave)
    {
        if (pWave == 1)
        {
            return false;
        }

        // Irregularly irregular RRs without P waves. With no P-wave judgement from delineation, the pre-QRS segments'
        // likeness to the sinus template stands in for it: fibrillatory waves are not alike from beat to beat.
        // Sinus-like P waves on the on-time beats rule fibrillation out, however irregular the RRs (frequent
        // premature atrial beats make them so).
        var noP = pWave == 0 || _atrialSimilarity < _s.FibrillationAtrialCorrelation;
        var sinusP = pWave != 0 && _atrialSimilarity >= _s.SinusAtrialCorrelation;
        var irregularity = _rhythm.Irregularity(orAll: noP);
        return (noP && irregularity > _s.IrregularityWithoutPThreshold) || (!sinusP && irregularity > _s.IrregularityThreshold);
    }

    private void Follow(BeatClass cls, double rrPrev)
    {
        // Irregularity is judged on the RRs between beats of the underlying rhythm: in sinus rhythm with frequent
        // ectopic beats those stay regular; in fibrillation the on-time RRs alone are irregular enough.
        if (cls is BeatClass.V or BeatClass.S)
        {
            _rhythm.MarkLatestEctopic();
        }

        // The local rhythm follows supraventricular RRs, but not those inside a run, which would pull it to the
        // run's own rate; an isolated premature RR and the pause after it balance out in the median.
        var supraventricular = cls is BeatClass.N or BeatClass.S && PreviousClass is BeatClass.N or BeatClass.S;
        if (supraventricular && !double.IsNaN(rrPrev) && !(cls == BeatClass.S && PreviousClass == BeatClass.S))
        {
            _rhythm.AddNormalRr(rrPrev);
        }

        _run = cls == BeatClass.S ? _run + 1 : 0;
        if (_run >= _s.MaxRunBeats)
        {
            // A run this long is a new rhythm, not a string of premature beats: the local rhythm starts again from it.
            _rhythm.ResetNormal();
        }

        PreviousClass = cls;
    }
}
