namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>
/// Multilead QRS boundaries, as practice reads the width from the lead where it is widest and clearest: the onset is
/// the earliest and the end the latest over the reliable leads. A lead is reliable when its QRS is steep enough
/// against the steepest lead's; a boundary that lies far outside the other leads' is set aside as an outlier, so one
/// noisy lead cannot stretch the width.
/// </summary>
internal static class MultileadQrs
{
    public static (float Onset, float Offset, float Confidence) Combine(ReadOnlySpan<LeadQrs> leads, float minSlopeFraction, float floorSnr, int outlierSamples)
    {
        var steepest = 0f;
        foreach (ref readonly var lead in leads)
        {
            if (lead.Usable)
            {
                steepest = Math.Max(steepest, lead.PeakSlope);
            }
        }

        if (steepest <= 0)
        {
            return (-1f, -1f, 0f);
        }

        var minSlope = minSlopeFraction * steepest;

        // The SNR floor never removes every lead: the clearest one always takes part.
        var clearest = 0f;
        foreach (ref readonly var lead in leads)
        {
            if (lead.Usable && lead.PeakSlope >= minSlope)
            {
                clearest = Math.Max(clearest, lead.Snr);
            }
        }

        floorSnr = Math.Min(floorSnr, clearest);
        var onset = Pick(leads, minSlope, floorSnr, outlierSamples, earliest: true, out var onsetAgree);
        var offset = Pick(leads, minSlope, floorSnr, outlierSamples, earliest: false, out var offsetAgree);
        var confidence = onset >= 0 && offset > onset ? 0.5f * (onsetAgree + offsetAgree) : 0f;
        return (onset, offset > onset ? offset : -1f, confidence);
    }

    private static float Pick(ReadOnlySpan<LeadQrs> leads, float minSlope, float floorSnr, int outlier, bool earliest, out float agreement)
    {
        // Best and second-best boundary over the reliable leads.
        var best = -1f;
        var second = -1f;
        var count = 0;
        foreach (ref readonly var lead in leads)
        {
            var at = earliest ? lead.OnsetAt : lead.OffsetAt;
            if (!lead.Usable || at < 0 || lead.PeakSlope < minSlope || lead.Snr < floorSnr)
            {
                continue;
            }

            count++;
            if (best < 0 || (earliest ? at < best : at > best))
            {
                second = best;
                best = at;
            }
            else if (second < 0 || (earliest ? at < second : at > second))
            {
                second = at;
            }
        }

        agreement = count == 0 ? 0 : count == 1 ? 0.5f : 1f;
        if (count >= 3 && Math.Abs(best - second) > outlier)
        {
            agreement = 0.75f;
            return second;
        }

        if (count == 2 && Math.Abs(best - second) > outlier)
        {
            agreement = 0.5f;
        }

        return best;
    }
}
