namespace LongRecord.Analysis.Beats.Classification;

/// <summary>
/// The atrial activity of the recent on-time supraventricular beats, judged two ways: how often delineation found a
/// P wave before the QRS, and how alike their pre-QRS segments are to the sinus template's. Together with the RR
/// irregularity it tells atrial fibrillation (irregularly irregular RRs, no P waves) from sinus rhythm with
/// premature beats. A running mean over about the last 16 beats, so one fibrillatory wave taken for a P wave, or
/// one P wave missed, does not swing it.
/// </summary>
internal sealed class AtrialActivity
{
    private const int Beats = 16;

    private readonly ClassificationSettings _s;
    private long _judged;
    private long _compared;

    public AtrialActivity(ClassificationSettings settings)
    {
        _s = settings;
    }

    /// <summary>Running share of on-time beats with a P wave found (NaN until delineation judged a few).</summary>
    public double PPresence { get; private set; } = double.NaN;

    /// <summary>Running mean of the on-time beats' pre-QRS likeness to the sinus template's (starts at 1).</summary>
    public double Similarity { get; private set; } = 1;

    /// <summary>An on-time (not premature) supraventricular beat.</summary>
    public void AddOnTime(sbyte pWave, double atrialCorrelation)
    {
        if (pWave >= 0)
        {
            _judged++;
            var p = pWave == 1 ? 1.0 : 0.0;
            PPresence = double.IsNaN(PPresence) ? p : PPresence + (p - PPresence) / Math.Min(_judged, Beats);
        }

        if (!double.IsNaN(atrialCorrelation))
        {
            _compared++;
            Similarity += (atrialCorrelation - Similarity) / Math.Min(_compared + 1, Beats);
        }
    }

    /// <summary>
    /// Atrial fibrillation: P waves mostly absent and the RRs between beats of the underlying rhythm irregular.
    /// Without P-wave judgements from delineation, the pre-QRS likeness stands in: fibrillatory waves are not alike
    /// from beat to beat, sinus P waves are.
    /// </summary>
    public bool Fibrillation(RhythmContext rhythm)
    {
        var judged = _judged >= Beats / 2;
        var noP = judged ? PPresence < _s.FibrillationPPresence : Similarity < _s.FibrillationAtrialCorrelation;
        var fewP = judged ? PPresence < _s.SinusPPresence : Similarity < _s.SinusAtrialCorrelation;
        if (!noP && !fewP)
        {
            return false;
        }

        var irregularity = rhythm.Irregularity(orAll: noP);
        return (noP && irregularity > _s.IrregularityWithoutPThreshold) || (fewP && irregularity > _s.IrregularityThreshold);
    }
}
