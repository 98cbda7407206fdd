namespace LongRecord.Analysis.Beats.Classification;

/// <summary>
/// The rules that turn a beat's shape (against the recording's normal template) and its timing (against the local
/// rhythm) into an EC57 class.
/// <list type="bullet">
/// <item>V: a shape unlike the normal one (correlation below 0.9, or wider) and not narrower than it (unless the
/// normal beat itself is as wide as a bundle-branch block), which is
/// premature and either clearly unlike (below 0.7), wide, or followed by a full compensatory pause; or, on time,
/// clearly unlike and either wide or from a cluster whose beats are mostly premature; or, on time, from a cluster whose
/// beats were mostly decided V (a ventricular focus beating at a run's rate or after a pause is on time, and beats of
/// one cluster share their origin; half: our choice), except during atrial fibrillation.</item>
/// <item>S: a normal-like shape, premature against the local rhythm and abruptly shorter than the RR before, with a
/// pre-QRS segment unlike the sinus one (ectopic P, or P hidden in the T wave), followed by a longer RR (the pause)
/// or by more premature beats (a run). A run goes on while its RRs stay short against the rhythm before it; while it
/// looks like atrial fibrillation setting in (RRs jumping from beat to beat, pre-QRS segments unlike each other, few
/// P waves) its beats are N. Never during irregularly irregular rhythm without P waves on the on-time beats (atrial
/// fibrillation): conducted beats there are N.</item>
/// <item>Q: no usable signal; noise so strong that no shape can be judged; a noisy window whose shape no template
/// explains within its noise; or an on-time beat of a shape that matches no template. Correlations and amplitudes come
/// corrected for the noise the beat carries (<see cref="NoiseFloor"/>), so that a beat of a known shape in noise is
/// judged as it would be in clean signal.</item>
/// </list>
/// Published ideas behind the rules (all from memory): the RR features — coupling RR and the RR after it judged
/// against the local mean RR — of de Chazal, O'Dwyer and Reilly, IEEE Trans Biomed Eng 51(7), 2004, here as fixed
/// ratios rather than a trained discriminant; the compensatory pause (complete after a ventricular beat, which leaves
/// the sinus node alone; incomplete after an atrial one, which resets it) of the electrocardiography textbooks;
/// per-recording clustering of beat shapes with the dominant cluster as the normal beat, as in the patient-adaptive
/// classifiers (Llamedo and Martínez, IEEE Trans Biomed Eng 59(8), 2012), without their expert-labelled beats; and
/// absent P waves with irregular RRs as the mark of atrial fibrillation, as in the detectors that add atrial activity
/// to RR irregularity (for example Ladavich and Ghoraani, Biomed Signal Process Control 18, 2015).
/// </summary>
internal sealed class BeatDecision
{
    private readonly ClassificationSettings _s;
    private readonly RhythmContext _rhythm;
    private readonly AtrialActivity _atrial;
    private readonly SupraventricularRun _run = new();
    private bool _episodeContinues;

    public BeatDecision(ClassificationSettings settings, RhythmContext rhythm)
    {
        _s = settings;
        _rhythm = rhythm;
        _atrial = new AtrialActivity(settings);
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
        // Unclassifiable: no usable signal; noise so strong that it alone would take a beat of the normal shape below
        // the correlation at which shapes count as clearly different (no shape can be judged); or a noisy window whose
        // shape no template explains within its noise (an artefact, not a beat of a known origin).
        if (!beat.Valid || beat.SameShapeCorrelation < _s.DifferentCorrelation || (beat.Noise > _s.NoiseLimit && beat.NewShape))
        {
            cls = BeatClass.Q;
        }
        else
        {
            // Narrower than the normal beat rules a ventricular origin out only when the normal beat conducts
            // normally; behind a bundle-branch block an ectopic ventricular beat may well be the narrower one. The
            // block needs evidence: most of the normal template's beats measured wide, not a mean just over the limit.
            // In a noisy window, narrower means beyond what the normal beats' own width scatter explains.
            var narrower = beat.ExtraWidthMs < -beat.NarrowerLimitMs && !beat.NormalBlocked;
            var normalShape = beat.IsNormalTemplate || (beat.CorrelationToNormal >= _s.NormalCorrelation && beat.ExtraWidthMs < _s.WideExtraMs);
            var clearlyDifferent = beat.CorrelationToNormal < _s.DifferentCorrelation;
            var wide = beat.ExtraWidthMs >= _s.WideExtraMs;
            var compensatory = !double.IsNaN(rrNextS) && !double.IsNaN(local) && rrPrev + rrNextS >= _s.CompensatoryRatio * 2 * local;
            var ventricular = !normalShape && !narrower && (premature
                ? clearlyDifferent || wide || compensatory
                : (clearlyDifferent && (wide || beat.TemplatePrematureShare >= 0.5)) || VentricularCluster(beat));
            if (ventricular)
            {
                // An on-time beat of a shape not seen before is more often artefact than ectopy.
                cls = beat.NewShape && !premature ? BeatClass.Q : BeatClass.V;
            }
            else
            {
                cls = Supraventricular(rrPrev, rrBefore, rrNextS, local, premature, beat) ? BeatClass.S : BeatClass.N;
                if (!premature)
                {
                    _atrial.AddOnTime(beat.PWave, beat.AtrialCorrelation);
                }
            }
        }

        Follow(cls, rrPrev, local, beat);
        return (cls, flags);
    }

    // An on-time beat of a cluster whose beats were mostly decided V keeps that origin, except in atrial fibrillation:
    // there no beat is on time against a rhythm, and aberrant conduction of the irregular beats shares shapes with them.
    private bool VentricularCluster(in BeatClassifier.Pending beat) =>
        beat.TemplateVentricularShare >= 0.5 && !_atrial.Fibrillation(_rhythm);

    private bool Supraventricular(double rrPrev, double rrBefore, double rrNext, double local, bool premature, in BeatClassifier.Pending beat)
    {
        _episodeContinues = false;
        if (_run.Length > 0)
        {
            return ContinuesRun(rrPrev, beat);
        }

        if (!premature)
        {
            return false;
        }

        if (_atrial.Fibrillation(_rhythm))
        {
            return false;
        }

        var abrupt = double.IsNaN(rrBefore) || rrPrev < _s.AbruptRatio * rrBefore;
        var pauseOrRun = double.IsNaN(rrNext) || rrNext >= _s.PauseRatio * rrPrev || rrNext < _s.PrematureRatio * local;

        // A pre-QRS segment just like the sinus one means a sinus P wave: an early sinus beat (after a block, in
        // sinus arrhythmia), not an ectopic atrial one, whose P differs or hides in the T wave before.
        var sinusP = beat.AtrialCorrelation >= _s.SinusAtrialCorrelation;
        return abrupt && pauseOrRun && !sinusP;
    }

    // Inside a run of premature supraventricular beats, each further beat belongs to it while it stays premature
    // against the rhythm before the run: an ectopic atrial rhythm need not be regular (multifocal, or with varying
    // conduction), and its own rate must not become the reference it is judged against. While the run looks like
    // atrial fibrillation setting in (RRs jumping from beat to beat, pre-QRS segments unlike each other) its beats
    // are N; should it settle into a steady ectopic rhythm (a focus warming up), they are S again.
    private bool ContinuesRun(double rrPrev, in BeatClassifier.Pending beat)
    {
        if (_run.Length >= _s.MaxRunBeats || double.IsNaN(rrPrev) || rrPrev >= _s.PrematureRatio * _run.ReferenceRr)
        {
            return false;
        }

        _episodeContinues = true;
        var irregularity = _run.Irregularity(rrPrev);
        var pPresence = _run.PPresence(beat.PWave);
        var consistency = _run.Consistency(beat.AtrialToPrevious);
        var judged = _run.Length >= _s.RunJudgedAfterBeats;
        if (!_run.Suspended)
        {
            var fibrillatory = judged && consistency < _s.RunAtrialConsistency
                && (irregularity > _s.RunIrregularity || pPresence < _s.FibrillationPPresence);
            _run.Suspended = fibrillatory;
        }
        else
        {
            var steady = judged && consistency >= _s.RunAtrialConsistency && irregularity <= _s.RunIrregularity;
            _run.Suspended = !steady;
        }

        return !_run.Suspended;
    }

    private void Follow(BeatClass cls, double rrPrev, double local, in BeatClassifier.Pending beat)
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

        if (cls != BeatClass.S && !(cls == BeatClass.N && _episodeContinues))
        {
            _run.End();
        }
        else
        {
            if (_run.Length == 0)
            {
                _run.Start(local);
            }

            _run.Add(rrPrev, beat.PWave, beat.AtrialToPrevious);
        }

        if (_run.Length >= _s.MaxRunBeats)
        {
            // A run this long is a new rhythm, not a string of premature beats: the local rhythm starts again from it.
            _rhythm.ResetNormal();
        }

        PreviousClass = cls;
    }
}
