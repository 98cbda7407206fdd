using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Rhythm;

/// <summary>
/// Per-window figures. Times (analysable, AF) are split exactly at window borders; beats, rates and HRV belong to the
/// window holding the beat that ends each interval.
/// </summary>
internal static class TrendBuilder
{
    public static List<TrendRow> Build(RrSeries rr, WindowGrid grid, AnalysisSettings s, IReadOnlyList<RhythmEpisode> pauses)
    {
        var count = grid.Count;
        var analysable = new double[count];
        var af = new double[count];
        var rows = new List<TrendRow>(count);
        var beats = rr.Beats.Span;
        var k = s.Rhythm.RateAveragingBeats;
        for (var i = 1; i < rr.Count; i++)
        {
            if (rr.IsAnalysable(i))
            {
                var a = rr.TimeS(i - 1);
                var b = rr.TimeS(i);
                grid.Spread(a, b, analysable);
                if (rr.Has(i, IntervalFlags.Af))
                {
                    grid.Spread(a, b, af);
                }
            }
        }

        var pauseCount = new int[count];
        foreach (var p in pauses)
        {
            pauseCount[grid.IndexOf(p.StartS)]++;
        }

        var first = 0;
        for (var w = 0; w < count; w++)
        {
            // Beats [first, last) lie in window w (the last window takes any beat past the end).
            var end = grid.EndS(w);
            var last = first;
            while (last < rr.Count && (w == count - 1 || rr.TimeS(last) < end))
            {
                last++;
            }

            int sve = 0, ve = 0, intervals = 0;
            var rrSum = 0.0;
            for (var i = first; i < last; i++)
            {
                sve += beats[i].Class == BeatClass.S ? 1 : 0;
                ve += beats[i].Class == BeatClass.V ? 1 : 0;
                if (rr.IsAnalysable(i))
                {
                    intervals++;
                    rrSum += rr.RrS[i];
                }
            }

            var span = grid.EndS(w) - grid.StartS(w);
            var sufficient = span > 0 && analysable[w] >= s.Rhythm.MinAnalysableFraction * span && intervals > 0;
            var (max, min) = sufficient ? RateAverager.Extremes(rr, first, last, k) : (double.NaN, double.NaN);
            var hrv = sufficient ? HrvCalculator.TimeDomain(rr, first, last, s.Hrv.TriangularBinS, triangular: false) : HrvFigures.None;
            rows.Add(new TrendRow
            {
                Index = w,
                StartS = grid.StartS(w),
                EndS = grid.EndS(w),
                ClockStart = grid.ClockStart(w),
                AnalysableMinutes = analysable[w] / 60,
                Sufficient = sufficient,
                Beats = last - first,
                MinBpm = min,
                MeanBpm = sufficient ? 60.0 * intervals / rrSum : double.NaN,
                MaxBpm = max,
                Sve = sve,
                Ve = ve,
                AfMinutes = af[w] / 60,
                AfBurdenPercent = analysable[w] > 0 ? 100 * af[w] / analysable[w] : double.NaN,
                Pauses = pauseCount[w],
                SdnnMs = hrv.SdnnMs,
                RmssdMs = hrv.RmssdMs,
            });
            first = last;
        }

        return rows;
    }

    public static List<HrvSegment> Segments(RrSeries rr, WindowGrid grid, HrvSettings s)
    {
        var segments = new List<HrvSegment>(grid.Count);
        var first = 1;
        var t = new List<double>();
        var nn = new List<double>();
        var spectrum = new HrvSpectrum(s);
        for (var w = 0; w < grid.Count; w++)
        {
            var end = grid.EndS(w);
            var last = first;
            while (last < rr.Count && (w == grid.Count - 1 || rr.TimeS(last) < end))
            {
                last++;
            }

            t.Clear();
            nn.Clear();
            var covered = 0.0;
            for (var i = first; i < last; i++)
            {
                if (rr.Has(i, IntervalFlags.Nn))
                {
                    covered += rr.RrS[i];
                    t.Add(rr.TimeS(i));
                    nn.Add(rr.RrS[i]);
                }
            }

            var span = grid.EndS(w) - grid.StartS(w);
            var coverage = span > 0 ? Math.Min(1, covered / span) : 0;
            var sufficient = coverage >= s.MinSegmentNnFraction && nn.Count >= 4;
            var hrv = sufficient ? HrvCalculator.TimeDomain(rr, first, last, s.TriangularBinS, triangular: false) : HrvFigures.None;
            var (lf, hf) = sufficient
                ? spectrum.Bands(System.Runtime.InteropServices.CollectionsMarshal.AsSpan(t), System.Runtime.InteropServices.CollectionsMarshal.AsSpan(nn))
                : (double.NaN, double.NaN);
            segments.Add(new HrvSegment
            {
                StartS = grid.StartS(w),
                EndS = grid.EndS(w),
                NnCount = nn.Count,
                NnCoverage = coverage,
                Sufficient = sufficient,
                MeanNnMs = hrv.MeanNnMs,
                SdnnMs = hrv.SdnnMs,
                RmssdMs = hrv.RmssdMs,
                LfMs2 = lf,
                HfMs2 = hf,
            });
            first = last;
        }

        return segments;
    }
}
