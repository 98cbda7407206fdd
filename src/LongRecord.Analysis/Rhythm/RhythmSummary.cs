using LongRecord.Analysis.Beats;

namespace LongRecord.Analysis.Rhythm;

/// <summary>Whole-recording figures of the rhythm stage.</summary>
public sealed record RhythmSummary
{
    public required int TotalBeats { get; init; }

    /// <summary>Beats of each EC57 class (N, S, V, F, Q), all beats.</summary>
    public required IReadOnlyDictionary<BeatClass, int> BeatsByClass { get; init; }

    public required double RecordingS { get; init; }

    /// <summary>Time covered by analysable RR intervals.</summary>
    public required double AnalysableS { get; init; }

    public double AnalysablePercent => RecordingS > 0 ? 100 * AnalysableS / RecordingS : double.NaN;

    /// <summary>Lowest, mean and highest rate: mean = 60 × analysable intervals ÷ their time; extremes on the averaged rate.</summary>
    public required double HrMinBpm { get; init; }
    public required double HrMeanBpm { get; init; }
    public required double HrMaxBpm { get; init; }

    /// <summary>Where the averaged rate was lowest and highest.</summary>
    public required RatePeriod? Slowest { get; init; }
    public required RatePeriod? Fastest { get; init; }

    public required double AfS { get; init; }

    /// <summary>AF time ÷ analysable time, percent (af episodes only; af-brief not counted).</summary>
    public required double AfBurdenPercent { get; init; }

    public required int AfEpisodeCount { get; init; }
    public required int AfBriefCount { get; init; }
    public required double LongestAfS { get; init; }

    /// <summary>AF at the first analysable beat (onset not observed) / at the last (offset not observed).</summary>
    public required bool AfAtStart { get; init; }
    public required bool AfAtEnd { get; init; }

    /// <summary>Burden per 24 h counted from the recording's start.</summary>
    public required IReadOnlyList<DayBurden> BurdenPerDay { get; init; }

    /// <summary>
    /// Plain facts about the longest continuous AF against durations that guidelines use (24 h, 48 h, 7 days — from
    /// memory). Facts only: no interpretation.
    /// </summary>
    public required IReadOnlyList<DurationFact> AfDurationFacts { get; init; }

    public required int PauseCount { get; init; }
    public required int HighlightedPauseCount { get; init; }
    public required double LongestPauseS { get; init; }
    public required int BradycardiaCount { get; init; }

    /// <summary>Intervals longer than the beat-gap limit (no beats: missed detections or no signal), and their time.</summary>
    public required int BeatGapCount { get; init; }
    public required double BeatGapS { get; init; }

    public required HrvFigures Hrv { get; init; }

    /// <summary>SD of the 5-min segment NN means (sufficient segments), ms.</summary>
    public required double SdannMs { get; init; }

    /// <summary>Mean of the 5-min segment SDNNs (sufficient segments), ms.</summary>
    public required double SdnnIndexMs { get; init; }

    /// <summary>Mean LF and HF power and mean LF/HF ratio over the sufficient 5-min segments.</summary>
    public required double LfMs2 { get; init; }
    public required double HfMs2 { get; init; }
    public required double LfHfRatio { get; init; }

    /// <summary>Analysable time left out of HRV (not NN: ectopy, artefact, AF), and the AF part of it, seconds.</summary>
    public required double HrvExcludedS { get; init; }
    public required double HrvExcludedAfS { get; init; }
}

/// <summary>A stretch of averaged rate.</summary>
public sealed record RatePeriod(double StartS, double EndS, double Bpm);

/// <summary>AF burden of one 24 h day counted from the start (the last day may be shorter).</summary>
public sealed record DayBurden(int Day, double StartS, double EndS, double AnalysableS, double AfS, double BurdenPercent);

/// <summary>Whether the longest continuous AF reached a duration.</summary>
public sealed record DurationFact(double ThresholdH, bool LongestReached, int EpisodesReaching);
