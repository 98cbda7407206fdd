namespace LongRecord.Analysis.Rhythm;

/// <summary>Time-domain HRV of the NN intervals among intervals [from, to) of an RR series (see <see cref="HrvFigures"/>).</summary>
internal static class HrvCalculator
{
    public static HrvFigures TimeDomain(RrSeries rr, int from, int to, double binS, bool triangular)
    {
        from = Math.Max(from, 1);
        var count = 0;
        var sum = 0.0;
        for (var i = from; i < to; i++)
        {
            if (rr.Has(i, IntervalFlags.Nn))
            {
                count++;
                sum += rr.RrS[i];
            }
        }

        if (count == 0)
        {
            return HrvFigures.None;
        }

        var mean = sum / count;
        var squares = 0.0;
        var successive = 0;
        var successiveSquares = 0.0;
        var nn50 = 0;
        var maxNn = 0.0;
        for (var i = from; i < to; i++)
        {
            if (!rr.Has(i, IntervalFlags.Nn))
            {
                continue;
            }

            var x = (double)rr.RrS[i];
            squares += (x - mean) * (x - mean);
            maxNn = Math.Max(maxNn, x);
            if (i > from && rr.Has(i - 1, IntervalFlags.Nn))
            {
                var d = x - rr.RrS[i - 1];
                successive++;
                successiveSquares += d * d;
                nn50 += Math.Abs(d) > 0.050 ? 1 : 0;
            }
        }

        return new HrvFigures
        {
            NnCount = count,
            MeanNnMs = 1000 * mean,
            SdnnMs = count > 1 ? 1000 * Math.Sqrt(squares / (count - 1)) : double.NaN,
            RmssdMs = successive > 0 ? 1000 * Math.Sqrt(successiveSquares / successive) : double.NaN,
            Pnn50Percent = 100.0 * nn50 / count,
            TriangularIndex = triangular ? TriangularIndex(rr, from, to, binS, maxNn, count) : double.NaN,
            SuccessiveCount = successive,
            Nn50Count = nn50,
        };
    }

    // Histogram bins of width binS from 0 s: bin k holds NN in [k·bin, (k+1)·bin).
    private static double TriangularIndex(RrSeries rr, int from, int to, double binS, double maxNn, int count)
    {
        var bins = new int[(int)(maxNn / binS) + 2];
        var height = 0;
        for (var i = from; i < to; i++)
        {
            if (rr.Has(i, IntervalFlags.Nn))
            {
                var k = (int)(rr.RrS[i] / binS);
                height = Math.Max(height, ++bins[k]);
            }
        }

        return (double)count / height;
    }
}
