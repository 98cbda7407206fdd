using LongRecord.Analysis.Beats;

namespace LongRecord.Analysis.Episodes;

/// <summary>
/// The rhythm stage finds AF from the RR intervals, so its episodes can start a few beats late and end a few beats
/// late (its windows need irregular intervals on both sides). With P waves judged on the signal, an AF episode's ends
/// are moved to the P waves: up to four beats with a P wave at either end are left out, and up to twelve beats without
/// one just before it are taken in (a lone beat with a P among them too); a steady tail of sinus beats (see SteadyTail) is left out; a last interval over 1.5 times the episode's median RR that leads into sinus rhythm
/// (the pause as AF stops) is left out. Nothing moves when the beats carry no P-wave judgement.
/// </summary>
internal static class AfExtent
{
    private const int MaxBeats = 4;

    // Beats without a P wave just before the rhythm stage's AF are taken in up to this many: its 32-interval windows
    // can flag AF a dozen beats after the atria began to fibrillate, and a shorter reach left the first P-less beats of
    // the demo day's AF outside as a three-beat "junctional rhythm" (our choice, no source).
    private const int LeadInBeats = 12;
    private const double LongFactor = 1.5;

    // Our choice: sinus RR after AF in the synthetic catalogue stay within 3 %; 6 % as the episodes' steady fraction.
    private const double SteadyFraction = 0.06;

    public static (int First, int Last) Refine(BeatTrack t, int first, int last)
    {
        var f = first;
        var l = last;
        for (var k = 0; k < MaxBeats && f < l - 2 && t[f].PWave == 1; k++)
        {
            f++;
        }

        if (f == first)
        {
            for (var k = 0; k < LeadInBeats && f > 0 && t.HasRr(f) && t[f - 1].Class != BeatClass.V; k++)
            {
                // A lone beat with a P wave between beats without one is a fibrillatory wave read as P: it does not
                // end the lead-in; two in a row (sinus rhythm) do.
                var lone = t[f - 1].PWave == 1 && f > 1 && t[f - 2].PWave == 0 && t[f].PWave == 0;
                if (t[f - 1].PWave != 0 && !lone)
                {
                    break;
                }

                f--;
            }
        }

        for (var k = 0; k < MaxBeats && l > f + 2 && t[l].PWave == 1; k++)
        {
            l--;
        }

        if (l == last)
        {
            l = SteadyTail(t, f, l);
        }

        // The long interval into the first beat after AF (the pause as sinus rhythm resumes) ends the episode one beat
        // earlier when that beat's P wave was missed.
        if (l > f + 4 && l != last && t[l].PWave == 0 && t.HasRr(l) && t.RrS[l] > LongFactor * OnsetOffset.MedianRr(t, f + 1, l))
        {
            l--;
        }
        else if (l == last && l > f + 4 && t[l].PWave == 0 && t.HasRr(l) && t.RrS[l] > LongFactor * OnsetOffset.MedianRr(t, f + 1, l)
            && l + 1 < t.Count && t[l + 1].PWave == 1)
        {
            l--;
        }

        return (f, l);
    }

    // In noise the P wave of a sinus beat after AF is missed now and then, so the P-wave rule above stops at once. A
    // tail of up to four beats at the episode's end whose RR (the pause into it aside) are steady — each within
    // SteadyFraction of their median, which AF's intervals seldom are three times in a row — and of which at least
    // half carry a P wave is sinus rhythm again, and is left out.
    private static int SteadyTail(BeatTrack t, int f, int l)
    {
        for (var k = MaxBeats; k >= 3; k--)
        {
            var from = l - k + 1;
            if (from <= f + 4)
            {
                continue;
            }

            int withP = 0;
            for (var i = from; i <= l; i++)
            {
                withP += t[i].PWave == 1 ? 1 : 0;
            }

            var median = OnsetOffset.MedianRr(t, from + 1, l);
            var steady = withP * 2 >= k && !double.IsNaN(median);
            for (var i = from + 1; steady && i <= l; i++)
            {
                steady = t.HasRr(i) && Math.Abs(t.RrS[i] - median) <= SteadyFraction * median;
            }

            if (steady)
            {
                return from - 1;
            }
        }

        return l;
    }
}
