using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Rhythm;

/// <summary>Windows of consecutive analysable RR intervals, moved on by the hop; a gap restarts them.</summary>
internal static class IrregularityBuilder
{
    public static List<IrregularityWindow> Build(RrSeries rr, IrregularitySettings s)
    {
        var windows = new List<IrregularityWindow>();
        var x = new double[s.WindowBeats];
        var i = 1;
        while (i + s.WindowBeats <= rr.Count)
        {
            // Window of intervals [i, i + W) must be analysable throughout.
            var broken = -1;
            for (var j = i; j < i + s.WindowBeats; j++)
            {
                if (!rr.IsAnalysable(j))
                {
                    broken = j;
                }
            }

            if (broken >= 0)
            {
                i = broken + 1;
                continue;
            }

            var sum = 0.0;
            var af = 0;
            for (var j = 0; j < x.Length; j++)
            {
                x[j] = rr.RrS[i + j];
                sum += x[j];
                af += rr.Has(i + j, IntervalFlags.Af) ? 1 : 0;
            }

            var mean = sum / x.Length;
            double squares = 0, successive = 0;
            for (var j = 0; j < x.Length; j++)
            {
                squares += (x[j] - mean) * (x[j] - mean);
                if (j > 0)
                {
                    successive += (x[j] - x[j - 1]) * (x[j] - x[j - 1]);
                }
            }

            var sd = Math.Sqrt(squares / (x.Length - 1));
            var r = s.SampleEntropyR * sd;
            var sampEn = sd > 0 ? SampleEntropy.Compute(x, s.SampleEntropyM, r) : double.NaN;
            windows.Add(new IrregularityWindow
            {
                StartS = rr.TimeS(i - 1),
                EndS = rr.TimeS(i + s.WindowBeats - 1),
                Intervals = x.Length,
                MeanRrMs = 1000 * mean,
                Cv = sd / mean,
                RmssdMs = 1000 * Math.Sqrt(successive / (x.Length - 1)),
                SampleEntropy = sampEn,
                Cosen = double.IsNaN(sampEn) ? double.NaN : SampleEntropy.Coefficient(sampEn, r, mean),
                AfShare = (double)af / x.Length,
            });
            i += s.HopBeats;
        }

        return windows;
    }
}
