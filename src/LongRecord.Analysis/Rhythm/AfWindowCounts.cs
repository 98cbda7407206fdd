namespace LongRecord.Analysis.Rhythm;

/// <summary>Counts over the AF detector's sliding window (lags 1–3), updated as intervals enter and leave it.</summary>
internal struct AfWindowCounts
{
    public int Lags;
    public int Kept, Judged, Present, FCount, Swings;
    public double FSum;
    public int Compared1, Compared2, Compared3, Alike1, Alike2, Alike3, Large1, Large2, Large3;

    public void Clear()
    {
        Kept = Judged = Present = FCount = Swings = 0;
        FSum = 0;
        Compared1 = Compared2 = Compared3 = Alike1 = Alike2 = Alike3 = Large1 = Large2 = Large3 = 0;
    }

    /// <summary>Adds (sign +1) or removes (−1) one interval's measure word and its end beat's atrial evidence.</summary>
    public void Add(ushort m, sbyte pWave, float fScore, int sign)
    {
        if ((m & AfDetector.Kept) != 0)
        {
            Swings += (m & AfDetector.Swing) != 0 ? sign : 0;
            Kept += sign;
            Large1 += (m & AfDetector.Large(1)) != 0 ? sign : 0;
            Large2 += (m & AfDetector.Large(2)) != 0 ? sign : 0;
            Large3 += (m & AfDetector.Large(3)) != 0 ? sign : 0;
            Compared1 += (m & AfDetector.Compared(1)) != 0 ? sign : 0;
            Compared2 += (m & AfDetector.Compared(2)) != 0 ? sign : 0;
            Compared3 += (m & AfDetector.Compared(3)) != 0 ? sign : 0;
            Alike1 += (m & AfDetector.Alike(1)) != 0 ? sign : 0;
            Alike2 += (m & AfDetector.Alike(2)) != 0 ? sign : 0;
            Alike3 += (m & AfDetector.Alike(3)) != 0 ? sign : 0;
        }

        Judged += pWave >= 0 ? sign : 0;
        Present += pWave == 1 ? sign : 0;
        if (!float.IsNaN(fScore))
        {
            FCount += sign;
            FSum += sign * fScore;
        }
    }

    /// <summary>
    /// The least, over lags, of (share of large differences − share of alike pairs): high only when the rhythm is
    /// irregular at every lag, low as soon as it repeats at one (bigeminal suppression).
    /// </summary>
    public readonly double IrregularityMargin()
    {
        var best = Margin(Compared1, Alike1, Large1);
        if (Lags >= 2 && Compared2 > 0)
        {
            best = Math.Min(best, Margin(Compared2, Alike2, Large2));
        }

        if (Lags >= 3 && Compared3 > 0)
        {
            best = Math.Min(best, Margin(Compared3, Alike3, Large3));
        }

        return best;
    }

    private static double Margin(int compared, int alike, int large) => compared > 0 ? (double)(large - alike) / compared : 0;
}
