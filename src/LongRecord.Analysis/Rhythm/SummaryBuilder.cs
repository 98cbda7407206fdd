using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Settings;

namespace LongRecord.Analysis.Rhythm;

/// <summary>Whole-recording figures from the series, the episodes and the segments.</summary>
internal static class SummaryBuilder
{
    // Durations guidelines use for continuous AF, hours (24 h, 48 h, 7 days — from memory). Stated as facts only.
    private static readonly double[] s_guidelineHours = [24, 48, 7 * 24];

    public static RhythmSummary Build(RrSeries rr, RhythmInput input, AnalysisSettings s, IReadOnlyList<RhythmEpisode> episodes, IReadOnlyList<HrvSegment> segments)
    {
        var beats = rr.Beats.Span;
        var byClass = new Dictionary<BeatClass, int>();
        foreach (var c in Enum.GetValues<BeatClass>())
        {
            byClass[c] = 0;
        }

        foreach (var b in beats)
        {
            byClass[b.Class]++;
        }

        double analysable = 0, rrSum = 0, afS = 0, gapS = 0, nnS = 0, excludedAfS = 0;
        int intervals = 0, gaps = 0, firstAnalysable = -1, lastAnalysable = -1;
        var days = new WindowGrid(input.DurationS, 86400, null, false);
        var dayAnalysable = new double[Math.Max(days.Count, 1)];
        var dayAf = new double[Math.Max(days.Count, 1)];
        for (var i = 1; i < rr.Count; i++)
        {
            if (!rr.IsAnalysable(i))
            {
                if (rr.RrS[i] > s.Rhythm.MaxBeatGapS)
                {
                    gaps++;
                    gapS += rr.RrS[i];
                }

                continue;
            }

            firstAnalysable = firstAnalysable < 0 ? i : firstAnalysable;
            lastAnalysable = i;
            intervals++;
            rrSum += rr.RrS[i];
            analysable += rr.RrS[i];
            var a = rr.TimeS(i - 1);
            var e = rr.TimeS(i);
            days.Spread(a, e, dayAnalysable);
            if (rr.Has(i, IntervalFlags.Af))
            {
                afS += rr.RrS[i];
                days.Spread(a, e, dayAf);
            }

            if (rr.Has(i, IntervalFlags.Nn))
            {
                nnS += rr.RrS[i];
            }
            else if (rr.Has(i, IntervalFlags.Af | IntervalFlags.AfBrief))
            {
                excludedAfS += rr.RrS[i];
            }
        }

        var (max, min, slowest, fastest) = Extremes(rr, s.Rhythm.RateAveragingBeats);
        var af = episodes.Where(e => e.Kind == RhythmEpisode.AfKind).ToList();
        var pauses = episodes.Where(e => e.Kind == RhythmEpisode.PauseKind).ToList();
        var longest = af.Count > 0 ? af.Max(e => e.DurationS) : 0;
        var good = segments.Where(g => g.Sufficient).ToList();
        var perDay = new List<DayBurden>();
        for (var d = 0; d < days.Count; d++)
        {
            perDay.Add(new DayBurden(d + 1, days.StartS(d), days.EndS(d), dayAnalysable[d], dayAf[d], dayAnalysable[d] > 0 ? 100 * dayAf[d] / dayAnalysable[d] : double.NaN));
        }

        return new RhythmSummary
        {
            TotalBeats = beats.Length,
            BeatsByClass = byClass,
            RecordingS = input.DurationS,
            AnalysableS = analysable,
            HrMinBpm = min,
            HrMeanBpm = intervals > 0 ? 60.0 * intervals / rrSum : double.NaN,
            HrMaxBpm = max,
            Slowest = slowest,
            Fastest = fastest,
            AfS = afS,
            AfBurdenPercent = analysable > 0 ? 100 * afS / analysable : double.NaN,
            AfEpisodeCount = af.Count,
            AfBriefCount = episodes.Count(e => e.Kind == RhythmEpisode.AfBriefKind),
            LongestAfS = longest,
            AfAtStart = firstAnalysable > 0 && rr.Has(firstAnalysable, IntervalFlags.Af),
            AfAtEnd = lastAnalysable > 0 && rr.Has(lastAnalysable, IntervalFlags.Af),
            BurdenPerDay = perDay,
            AfDurationFacts = s_guidelineHours.Select(h => new DurationFact(h, longest >= h * 3600, af.Count(e => e.DurationS >= h * 3600))).ToList(),
            PauseCount = pauses.Count,
            HighlightedPauseCount = pauses.Count(p => p.Highlighted),
            LongestPauseS = pauses.Count > 0 ? pauses.Max(p => p.DurationS) : 0,
            BradycardiaCount = episodes.Count(e => e.Kind == RhythmEpisode.BradycardiaKind),
            BeatGapCount = gaps,
            BeatGapS = gapS,
            Hrv = HrvCalculator.TimeDomain(rr, 1, rr.Count, s.Hrv.TriangularBinS, triangular: true),
            SdannMs = good.Count > 1 ? StandardDeviation(good.Select(g => g.MeanNnMs)) : double.NaN,
            SdnnIndexMs = good.Count > 0 ? good.Average(g => g.SdnnMs) : double.NaN,
            LfMs2 = good.Count > 0 ? good.Average(g => g.LfMs2) : double.NaN,
            HfMs2 = good.Count > 0 ? good.Average(g => g.HfMs2) : double.NaN,
            LfHfRatio = good.Count > 0 ? good.Average(g => g.LfHfRatio) : double.NaN,
            HrvExcludedS = analysable - nnS,
            HrvExcludedAfS = excludedAfS,
        };
    }

    private static (double Max, double Min, RatePeriod? Slowest, RatePeriod? Fastest) Extremes(RrSeries rr, int k)
    {
        double max = double.NaN, min = double.NaN, sum = 0;
        int run = 0, maxAt = -1, minAt = -1;
        for (var i = 1; i < rr.Count; i++)
        {
            if (!rr.IsAnalysable(i))
            {
                sum = 0;
                run = 0;
                continue;
            }

            sum += rr.RrS[i];
            if (++run > k)
            {
                sum -= rr.RrS[i - k];
                run = k;
            }

            if (run == k)
            {
                var bpm = 60.0 * k / sum;
                if (double.IsNaN(max) || bpm > max)
                {
                    max = bpm;
                    maxAt = i;
                }

                if (double.IsNaN(min) || bpm < min)
                {
                    min = bpm;
                    minAt = i;
                }
            }
        }

        RatePeriod? Period(int end, double bpm) => end < 0 ? null : new RatePeriod(rr.TimeS(end - k), rr.TimeS(end), bpm);
        return (max, min, Period(minAt, min), Period(maxAt, max));
    }

    private static double StandardDeviation(IEnumerable<double> values)
    {
        var list = values.ToList();
        var mean = list.Average();
        return Math.Sqrt(list.Sum(v => (v - mean) * (v - mean)) / (list.Count - 1));
    }
}
