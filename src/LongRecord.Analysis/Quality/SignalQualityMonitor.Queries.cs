using LongRecord.Analysis.Beats;

namespace LongRecord.Analysis.Quality;

/// <summary>Queries on the finished windows, for beat <c>lead_quality</c> and for down-weighting bad leads.</summary>
public sealed partial class SignalQualityMonitor
{
    /// <summary>The state of lead <paramref name="lead"/> at <paramref name="sample"/>, when that window is finished.</summary>
    public bool TryGetLeadState(int lead, long sample, out LeadState state)
    {
        var list = _leadStretches[CheckLead(lead)];
        int lo = 0, hi = list.Count - 1;
        while (lo <= hi)
        {
            var mid = (lo + hi) >>> 1;
            if (sample < list[mid].StartSample)
            {
                hi = mid - 1;
            }
            else if (sample >= list[mid].EndSample)
            {
                lo = mid + 1;
            }
            else
            {
                state = list[mid].State;
                return true;
            }
        }

        state = LeadState.Missing;
        return false;
    }

    /// <summary>The state of lead <paramref name="lead"/> at <paramref name="sample"/>; throws when that window is not finished yet.</summary>
    public LeadState LeadStateAt(int lead, long sample) =>
        TryGetLeadState(lead, sample, out var s) ? s
        : throw new ArgumentOutOfRangeException(nameof(sample), sample, $"no finished window holds sample {sample} (decided until {DecidedUntilSample})");

    /// <summary>True when lead <paramref name="lead"/> is good or noisy at <paramref name="sample"/> (for down-weighting bad leads).</summary>
    public bool IsUsable(int lead, long sample) => LeadStateAt(lead, sample).IsUsable();

    /// <summary>True when any lead is usable at <paramref name="sample"/>: beats may be emitted there.</summary>
    public bool IsAnalysableAt(long sample)
    {
        for (var k = 0; k < _leads; k++)
        {
            if (IsUsable(k, sample))
            {
                return true;
            }
        }

        return false;
    }

    /// <summary>
    /// The <c>lead_quality</c> of a beat at <paramref name="sample"/>: <see cref="LeadQuality.SingleLead"/> when only one
    /// lead of several is usable, <see cref="LeadQuality.Good"/> when at least two leads (or the only lead) are good,
    /// otherwise <see cref="LeadQuality.Noisy"/>.
    /// </summary>
    public LeadQuality BeatLeadQuality(long sample)
    {
        int usable = 0, good = 0;
        for (var k = 0; k < _leads; k++)
        {
            var s = LeadStateAt(k, sample);
            usable += s.IsUsable() ? 1 : 0;
            good += s == LeadState.Good ? 1 : 0;
        }

        return _leads > 1 && usable <= 1 ? LeadQuality.SingleLead
            : good >= Math.Min(2, _leads) ? LeadQuality.Good
            : LeadQuality.Noisy;
    }
}
