namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// Windows of one length laid over the recording, the first possibly shorter so that later ones start on the clock
/// (09:40 start, 1 h windows: 09:40–10:00, 10:00–11:00, …), or at elapsed multiples of the length when there is no
/// start time or clock alignment is off. The last window ends at the recording's end.
/// </summary>
public sealed class WindowGrid
{
    public WindowGrid(double durationS, double lengthS, DateTime? start, bool alignToClock)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(lengthS);
        DurationS = Math.Max(durationS, 0);
        LengthS = lengthS;
        Start = start;
        if (start is DateTime s && alignToClock)
        {
            var intoDayS = s.TimeOfDay.TotalSeconds;
            var r = intoDayS % lengthS;
            OffsetS = r == 0 ? 0 : lengthS - r;
        }

        Count = DurationS <= 0 ? 0 : OffsetS > 0
            ? (OffsetS >= DurationS ? 1 : 1 + (int)Math.Ceiling((DurationS - OffsetS) / lengthS))
            : (int)Math.Ceiling(DurationS / lengthS);
    }

    public double DurationS { get; }

    public double LengthS { get; }

    public DateTime? Start { get; }

    /// <summary>Length of the short first window (0 when the first window is whole).</summary>
    public double OffsetS { get; }

    public int Count { get; }

    public double StartS(int k) => k == 0 ? 0 : OffsetS > 0 ? OffsetS + (k - 1) * LengthS : k * LengthS;

    public double EndS(int k) => Math.Min(DurationS, OffsetS > 0 ? OffsetS + k * LengthS : (k + 1) * LengthS);

    /// <summary>Clock time at the start of window <paramref name="k"/>, or null without a start time.</summary>
    public DateTime? ClockStart(int k) => Start?.AddSeconds(StartS(k));

    /// <summary>Window holding time <paramref name="tS"/> (clamped to the first and last).</summary>
    public int IndexOf(double tS)
    {
        if (Count == 0)
        {
            return 0;
        }

        var k = OffsetS > 0
            ? (tS < OffsetS ? 0 : 1 + (int)Math.Floor((tS - OffsetS) / LengthS))
            : (int)Math.Floor(tS / LengthS);
        return Math.Clamp(k, 0, Count - 1);
    }

    /// <summary>
    /// Adds the time of [<paramref name="a"/>, <paramref name="b"/>) to <paramref name="perWindow"/>, split at window
    /// borders (intervals are seconds long, windows minutes: at most a few windows are touched).
    /// </summary>
    public void Spread(double a, double b, double[] perWindow)
    {
        if (Count == 0 || b <= a)
        {
            return;
        }

        for (var k = IndexOf(a); k < Count; k++)
        {
            var lo = k == 0 ? double.NegativeInfinity : StartS(k);
            var hi = k == Count - 1 ? double.PositiveInfinity : EndS(k);
            var overlap = Math.Min(b, hi) - Math.Max(a, lo);
            if (overlap > 0)
            {
                perWindow[k] += overlap;
            }

            if (hi >= b)
            {
                break;
            }
        }
    }
}
