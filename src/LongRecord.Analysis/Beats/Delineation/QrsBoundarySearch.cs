using LongRecord.Analysis.Numerics;

namespace LongRecord.Analysis.Beats.Delineation;

/// <summary>
/// Single-lead QRS boundaries after Laguna, Jané and Caminal (1994). On the derivative of the low-passed lead the QRS
/// is a run of waves; each wave's limb (a run of one slope sign) has a slope peak. Starting from the steepest limb,
/// the search takes in the neighbouring limbs while they are significant (steep enough or tall enough against the
/// QRS), which finds the first and the last wave of the QRS; a brief notch does not end the run, a quiet segment does.
/// The onset is where the slope, walking outwards from the first wave's slope peak, falls below |peak| ÷ K_on; the end
/// likewise from the last wave with K_end.
/// </summary>
internal static class QrsBoundarySearch
{
    /// <summary>
    /// Searches for the QRS around <paramref name="centre"/> in <paramref name="x"/> (low-passed lead, mV) and
    /// <paramref name="slope"/> (its derivative, mV/s); boundaries stay within [<paramref name="low"/>, <paramref name="high"/>].
    /// <paramref name="activitySlope"/> is the slope level of what the lead shows outside the QRS (the floor of the
    /// thresholds), <paramref name="noiseSlope"/> its high-frequency noise (for the lead's SNR). A boundary that runs
    /// into a limit is reported as not found.
    /// </summary>
    public static void Find(
        ReadOnlySpan<float> x, ReadOnlySpan<float> slope, ReadOnlySpan<float> fineX,
        int centre, int low, int high, in QrsSearchSamples p, float activitySlope, float noiseSlope, ref LeadQrs lead)
    {
        lead.Onset = -1;
        lead.Offset = -1;
        lead.NoiseSlope = noiseSlope;
        lead.ActivitySlope = activitySlope;
        var from = Math.Max(low + 1, centre - p.PeakSearch);
        var to = Math.Min(high - 1, centre + p.PeakSearch);
        var peakAt = -1;
        var peak = 0f;
        var min = float.MaxValue;
        var max = float.MinValue;
        if (from <= to)
        {
            // The steepest slope (the first on ties) and the extremes of the stretch; no sample is NaN here.
            (peak, var at) = SpanStatistics.AbsolutePeak(slope[from..(to + 1)]);
            peakAt = at < 0 ? -1 : from + at;
            (min, max) = SpanStatistics.MinMax(x[from..(to + 1)]);
        }

        lead.PeakSlope = peak;
        lead.Amplitude = max - min;
        if (peakAt < 0 || peak <= 0)
        {
            return;
        }

        var sig = new Significance(
            p.SignificantFraction * peak, p.WeakFraction * peak, p.SignificantAmplitude * (max - min), p.WaveLimb, Math.Max(p.QuietFraction * peak, activitySlope), p.QuietGap, p.Notch);
        var first = Extend(x, slope, peakAt, low, -1, sig);
        var last = Extend(x, slope, peakAt, high, +1, sig);
        lead.FirstSlope = Math.Abs(slope[first]);
        lead.LastSlope = Math.Abs(slope[last]);

        var onThreshold = Math.Max(Math.Max(lead.FirstSlope / p.OnsetDivisor, p.GlobalOn * peak), p.NoiseMultiple * activitySlope);
        var offThreshold = Math.Max(Math.Max(lead.LastSlope / p.OffsetDivisor, p.GlobalOff * peak), p.NoiseMultiple * activitySlope);
        lead.Onset = Boundary(slope, first, low, -1, onThreshold, p.Sustain);
        lead.Offset = Boundary(slope, last, high, +1, offThreshold, p.Sustain);
        lead.OnsetAt = lead.Onset >= 0 ? Crossing(slope, lead.Onset, first, -1, onThreshold) : -1;
        lead.OffsetAt = lead.Offset >= 0 ? Crossing(slope, lead.Offset, last, +1, offThreshold) : -1;

        // The amplitude test runs on the lighter low-pass, which blurs the QRS edges less.
        x = fineX;

        // A slow tail that stays within a small fraction of the QRS amplitude of the level outside it is not QRS.
        if (lead.Onset >= 0 && p.AmplitudeOn > 0)
        {
            lead.OnsetAt = Trim(x, lead.Onset, first, -1, p.LevelSamples, p.AmplitudeOn * (max - min), lead.OnsetAt);
            lead.Onset = (int)Math.Round(lead.OnsetAt);
        }

        if (lead.Offset >= 0 && p.AmplitudeOff > 0)
        {
            lead.OffsetAt = Trim(x, lead.Offset, last, +1, p.LevelSamples, p.AmplitudeOff * (max - min), lead.OffsetAt);
            lead.Offset = (int)Math.Round(lead.OffsetAt);
        }
    }

    // Moves a boundary inwards (towards `inner`) while the signal stays within `tolerance` of the level just outside it.
    private static float Trim(ReadOnlySpan<float> x, int boundary, int inner, int dir, int levelSamples, float tolerance, float position)
    {
        // Level: the mean over the stretch just outside the boundary (dir = −1: before the onset).
        var a = dir < 0 ? Math.Max(0, boundary - levelSamples) : boundary;
        var b = dir < 0 ? boundary : Math.Min(x.Length - 1, boundary + levelSamples);
        var level = 0f;
        for (var i = a; i <= b; i++)
        {
            level += x[i];
        }

        level /= b - a + 1;
        var j = boundary;
        while (j != inner && Math.Abs(x[j - dir] - level) <= tolerance)
        {
            j -= dir;
        }

        if (j == boundary)
        {
            return position;
        }

        // Between j (within the tolerance) and its inner neighbour (beyond it).
        var within = Math.Abs(x[j] - level);
        var beyond = Math.Abs(x[j - dir] - level);
        var f = j != inner && beyond > within ? Math.Clamp((tolerance - within) / (beyond - within), 0f, 1f) : 0f;
        return j - dir * f;
    }

    // Where |d| crosses the threshold between the boundary sample (at or under it) and its inner neighbour.
    private static float Crossing(ReadOnlySpan<float> d, int boundary, int inner, int dir, float threshold)
    {
        if (boundary == inner)
        {
            return boundary;
        }

        var a = Math.Abs(d[boundary]);
        var b = Math.Abs(d[boundary - dir]);
        var f = b > a ? Math.Clamp((threshold - a) / (b - a), 0f, 1f) : 0f;
        return boundary - dir * f;
    }

    // Walks limb by limb from the slope peak at `start` in direction `dir`; returns the slope peak of the outermost
    // significant limb still joined to the QRS.
    private static int Extend(ReadOnlySpan<float> x, ReadOnlySpan<float> d, int start, int limit, int dir, in Significance sig)
    {
        var current = start;
        while (true)
        {
            var edge = LimbEdge(d, current, limit, dir);
            var next = edge + dir;
            if (!Inside(next, limit, dir))
            {
                return current;
            }

            var nextEdge = LimbEdge(d, next, limit, dir);
            var nextPeak = LimbPeak(d, next, nextEdge);
            if (!Quiet(d, edge, nextPeak, dir, sig) && sig.Holds(Math.Abs(d[nextPeak]), Math.Abs(x[nextEdge] - x[edge]), Math.Abs(nextEdge - edge)))
            {
                current = nextPeak;
                continue;
            }

            // A brief, small opposite limb (a notch or slur) with a significant limb beyond it: the QRS goes on.
            var beyond = nextEdge + dir;
            if (Math.Abs(nextEdge - edge) <= sig.NotchSamples && Inside(beyond, limit, dir))
            {
                var beyondEdge = LimbEdge(d, beyond, limit, dir);
                var beyondPeak = LimbPeak(d, beyond, beyondEdge);
                if (!Quiet(d, edge, beyondPeak, dir, sig) && sig.Holds(Math.Abs(d[beyondPeak]), Math.Abs(x[beyondEdge] - x[nextEdge]), Math.Abs(beyondEdge - nextEdge)))
                {
                    current = beyondPeak;
                    continue;
                }
            }

            return current;
        }
    }

    // True when a quiet stretch (slope under the quiet level for the gap length) lies between a and b.
    private static bool Quiet(ReadOnlySpan<float> d, int a, int b, int dir, in Significance sig)
    {
        var run = 0;
        for (var i = a; i != b; i += dir)
        {
            if (Math.Abs(d[i]) < sig.Quiet)
            {
                if (++run >= sig.GapSamples)
                {
                    return true;
                }
            }
            else
            {
                run = 0;
            }
        }

        return false;
    }

    // From a slope peak, walk outwards until the slope has stayed at or under the threshold for `sustain` samples;
    // the boundary is where it first went under.
    private static int Boundary(ReadOnlySpan<float> d, int from, int limit, int dir, float threshold, int sustain)
    {
        if (sustain > 0)
        {
            var run = 0;
            var candidate = -1;
            for (var i = from; Inside(i, limit, dir); i += dir)
            {
                if (Math.Abs(d[i]) <= threshold)
                {
                    if (run++ == 0)
                    {
                        candidate = i;
                    }

                    if (run >= sustain)
                    {
                        return candidate;
                    }
                }
                else
                {
                    run = 0;
                }
            }

            return run > 0 ? candidate : -1;
        }

        var sign = SignOf(d[from]);
        var j = from;
        while (Inside(j + dir, limit, dir) && Math.Abs(d[j]) > threshold && SignOf(d[j + dir]) == sign)
        {
            j += dir;
        }

        return Inside(j + dir, limit, dir) || Math.Abs(d[j]) <= threshold ? j : -1;
    }

    // Last index, going in `dir` from i, that keeps the slope sign of i.
    private static int LimbEdge(ReadOnlySpan<float> d, int i, int limit, int dir)
    {
        var sign = SignOf(d[i]);
        var j = i;
        while (Inside(j + dir, limit, dir) && SignOf(d[j + dir]) == sign && sign != 0)
        {
            j += dir;
        }

        return j;
    }

    private static int LimbPeak(ReadOnlySpan<float> d, int a, int b)
    {
        var lo = Math.Min(a, b);
        var hi = Math.Max(a, b);
        var at = lo;
        for (var i = lo + 1; i <= hi; i++)
        {
            if (Math.Abs(d[i]) > Math.Abs(d[at]))
            {
                at = i;
            }
        }

        return at;
    }

    // The sign of a finite slope without Math.Sign's NaN check, which keeps it from being inlined in the limb walks.
    private static int SignOf(float v) => (v > 0 ? 1 : 0) - (v < 0 ? 1 : 0);

    private static bool Inside(int i, int limit, int dir) => dir < 0 ? i > limit : i < limit;

    private readonly record struct Significance(float Slope, float WeakSlope, float Amplitude, int WaveSamples, float Quiet, int GapSamples, int NotchSamples)
    {
        // A limb is part of the QRS when steep, or when it is a short, tall enough wave of moderate slope (a slow q or s).
        public bool Holds(float slope, float amplitude, int samples) =>
            slope >= Slope || (slope >= WeakSlope && amplitude >= Amplitude && samples <= WaveSamples);
    }
}

/// <summary>The QRS search settings turned into samples for one sampling rate.</summary>
internal readonly record struct QrsSearchSamples(
    int PeakSearch, int Notch, int QuietGap, int WaveLimb, float SignificantFraction, float WeakFraction, float SignificantAmplitude, float QuietFraction,
    float OnsetDivisor, float OffsetDivisor, float NoiseMultiple, int Sustain, float GlobalOn, float GlobalOff,
    int LevelSamples = 1, float AmplitudeOn = 0, float AmplitudeOff = 0);
