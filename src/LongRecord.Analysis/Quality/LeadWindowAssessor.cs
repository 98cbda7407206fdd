using LongRecord.Analysis.Numerics;

namespace LongRecord.Analysis.Quality;

/// <summary>What one lead's blocks say about one window, before neighbouring windows are considered.</summary>
/// <param name="Base">Missing, Saturated or Flat from the raw samples, or Good when the lead carries a signal.</param>
/// <param name="SlopeIndex">Quiet level of the QRS-band slope over the lead's QRS slope reference (0 before a reference exists).</param>
/// <param name="LowFrequencyIndex">Low-frequency activity over the lead's QRS amplitude reference.</param>
/// <param name="PeakRatio">Quiet level over the peak of the QRS-band slope within the window's context (1: nothing stands out).</param>
/// <param name="ResidualIndex">Median beat-to-beat residual outside the QRS over the lead's QRS amplitude reference (NaN: no complexes found or no reference).</param>
/// <param name="Complexes">QRS-like complexes the residual tracker located around the window.</param>
/// <param name="AmplitudeRatio">The window's conditioned range over the lead's QRS amplitude reference (NaN before a reference exists).</param>
internal readonly record struct LeadWindowFeatures(LeadState Base, float SlopeIndex, float LowFrequencyIndex, float ResidualIndex, float PeakRatio, int Complexes, float AmplitudeRatio)
{
    public bool HasSignal => Base == LeadState.Good;

    /// <summary>
    /// Complexes that repeat beat after beat (a small residual): an organised rhythm, however fast or broad. Noise
    /// would make neighbouring beats differ.
    /// </summary>
    public bool IsOrganised(QualitySettings settings) => ResidualIndex < settings.OrganisedResidualIndex;

    /// <summary>
    /// No QRS stands out: the slope peaks are even across the window, or no complex reaching the QRS slope level was
    /// found although the lead swings like its QRS complexes (fibrillation is slower-sloped than the complexes).
    /// </summary>
    public bool LacksQrs(QualitySettings settings) =>
        PeakRatio >= settings.ChaoticPeakRatio || (Complexes == 0 && AmplitudeRatio >= settings.ChaoticMinAmplitude);
}

/// <summary>
/// Judges one lead per window from its 100 ms blocks and keeps the lead's QRS references: medians of the slope peak
/// and the conditioned range of recent windows where a QRS clearly stood out, so the references follow the lead's own
/// amplitude but not its noise.
/// </summary>
internal sealed class LeadWindowAssessor
{
    private const int MaxContextBlocks = 20;

    // References from fewer windows are not trusted (the first window starts with the conditioner settling).
    private const int MinReferenceWindows = 5;

    private readonly QualitySettings _settings;
    private readonly RunningMedian _slopeHistory;
    private readonly RunningMedian _amplitudeHistory;
    private float _slopeReference;
    private float _amplitudeReference;

    public LeadWindowAssessor(QualitySettings settings)
    {
        _settings = settings;
        _slopeHistory = new RunningMedian(settings.ReferenceWindows);
        _amplitudeHistory = new RunningMedian(settings.ReferenceWindows);
    }

    /// <summary>The lead's QRS-band slope reference (0 until one window qualified).</summary>
    public float SlopeReference => _slopeReference;

    /// <summary>
    /// Own blocks [ownFrom, ownTo) make the window; context blocks [contextFrom, contextTo) surround it;
    /// <paramref name="residualMv"/> is the median beat residual around it (NaN: no beats) and <paramref name="complexes"/>
    /// the number of complexes located there.
    /// </summary>
    public LeadWindowFeatures Assess(LeadSignalBlocks blocks, long ownFrom, long ownTo, long contextFrom, long contextTo, float residualMv, int complexes)
    {
        int valid = 0, missing = 0, stuck = 0, railed = 0, plateau = 0;
        float rawMin = float.PositiveInfinity, rawMax = float.NegativeInfinity;
        float condMin = float.PositiveInfinity, condMax = float.NegativeInfinity, ownPeak = 0;
        for (var j = ownFrom; j < ownTo; j++)
        {
            ref readonly var b = ref blocks.Block(j);
            valid += b.Valid;
            missing += b.Missing;
            stuck += b.Stuck;
            railed += b.Railed;
            plateau += b.Plateau;
            rawMin = Math.Min(rawMin, b.RawMin);
            rawMax = Math.Max(rawMax, b.RawMax);
            condMin = Math.Min(condMin, b.CondMin);
            condMax = Math.Max(condMax, b.CondMax);
            ownPeak = Math.Max(ownPeak, b.SlopePeak);
        }

        var s = _settings;
        var tolerance = (float)s.RailToleranceMv;
        LeadState state;
        if (valid == 0 || missing >= s.MissingFraction * (valid + missing))
        {
            state = LeadState.Missing;
        }
        else if (railed >= s.SaturatedFraction * valid)
        {
            state = LeadState.Saturated;
        }
        else if (rawMax - rawMin <= s.FlatRangeMv)
        {
            state = LeadState.Flat;
        }
        else if (plateau >= s.SaturatedFraction * valid && ClippedAtExtremes(blocks, ownFrom, ownTo, rawMin + tolerance, rawMax - tolerance) >= s.SaturatedFraction * valid)
        {
            // A plateau at the window's own extreme: clipping where the rails are unknown or lie inside them.
            state = LeadState.Saturated;
        }
        else if (stuck >= s.StuckFraction * valid)
        {
            state = LeadState.Flat;
        }
        else
        {
            state = LeadState.Good;
        }

        if (state != LeadState.Good)
        {
            return new LeadWindowFeatures(state, 0, 0, float.NaN, 1, 0, 0);
        }

        Span<float> peaks = stackalloc float[MaxContextBlocks];
        Span<float> steps = stackalloc float[MaxContextBlocks];
        int n = 0, m = 0;
        var lastMean = float.NaN;
        for (var j = contextFrom; j < contextTo && n < MaxContextBlocks; j++)
        {
            ref readonly var b = ref blocks.Block(j);
            if (b.CondCount == 0)
            {
                continue;
            }

            peaks[n++] = b.SlopePeak;
            var mean = b.CondMean;
            if (!float.IsNaN(lastMean))
            {
                steps[m++] = Math.Abs(mean - lastMean);
            }

            lastMean = mean;
        }

        peaks = peaks[..n];
        var peak = 0f;
        foreach (var p in peaks)
        {
            peak = Math.Max(peak, p);
        }

        // The 25th percentile of the block peaks lies between the complexes at any rate up to about 150 per minute:
        // QRS complexes touch at most half the blocks.
        var quiet = n > 0 ? Select(peaks, n / 4) : 0;
        var ratio = peak > 0 ? quiet / peak : 1;
        var lowFrequency = m > 0 ? Select(steps[..m], m / 4) : 0;
        var ownRange = condMax - condMin;
        var features = new LeadWindowFeatures(
            LeadState.Good,
            _slopeReference > 0 ? quiet / _slopeReference : 0,
            _amplitudeReference > 0 ? lowFrequency / _amplitudeReference : 0,
            _amplitudeReference > 0 && !float.IsNaN(residualMv) ? residualMv / _amplitudeReference : float.NaN,
            ratio,
            complexes,
            _amplitudeReference > 0 && float.IsFinite(ownRange) ? ownRange / _amplitudeReference : float.NaN);
        if (ratio < s.ReferenceGateRatio && ownPeak > 0 && float.IsFinite(ownRange))
        {
            Remember(ownPeak, ownRange);
        }

        return features;
    }

    private static int ClippedAtExtremes(LeadSignalBlocks blocks, long from, long to, float low, float high)
    {
        var clipped = 0;
        for (var j = from; j < to; j++)
        {
            ref readonly var b = ref blocks.Block(j);
            if (b.Plateau > 0 && (b.PlateauMax >= high || b.PlateauMin <= low))
            {
                clipped += b.Plateau;
            }
        }

        return clipped;
    }

    private void Remember(float slopePeak, float range)
    {
        _slopeHistory.Add(slopePeak);
        _amplitudeHistory.Add(range);
        if (_slopeHistory.Count >= MinReferenceWindows)
        {
            _slopeReference = _slopeHistory.Median;
            _amplitudeReference = _amplitudeHistory.Median;
        }
    }

    // The k-th smallest value (0-based) of at most MaxContextBlocks values, by rank (Selection.Nth on a copy). A NaN
    // has no rank, so values with one keep the old way and its answer.
    private static float Select(ReadOnlySpan<float> values, int k)
    {
        if (SpanStatistics.HasNaN(values))
        {
            return SelectInOrder(values, k);
        }

        Span<float> copy = stackalloc float[MaxContextBlocks];
        values.CopyTo(copy);
        return Selection.Nth(copy[..values.Length], k);
    }

    // The k + 1 smallest kept in order while the values pass (k is 4 or 5 here).
    private static float SelectInOrder(ReadOnlySpan<float> values, int k)
    {
        Span<float> smallest = stackalloc float[k + 1];
        var n = 0;
        foreach (var v in values)
        {
            if (n == smallest.Length && v >= smallest[n - 1])
            {
                continue;
            }

            var at = n == smallest.Length ? n - 1 : n++;
            while (at > 0 && smallest[at - 1] > v)
            {
                smallest[at] = smallest[at - 1];
                at--;
            }

            smallest[at] = v;
        }

        return smallest[Math.Min(k, n - 1)];
    }
}
