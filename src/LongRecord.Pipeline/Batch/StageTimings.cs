using System.Diagnostics;
using System.Globalization;
using System.Text;
using LongRecord.Analysis.Beats;

namespace LongRecord.Pipeline.Batch;

/// <summary>
/// Wall time per stage of one recording's summary: reading (decode and everything of the beats pass that is not one of
/// its parts), the beats stage's parts (<see cref="BeatStageTimings"/>), the stages after it, and writing the outputs.
/// </summary>
public sealed class StageTimings
{
    private readonly List<(string Stage, double Seconds)> _stages = [];

    public IReadOnlyList<(string Stage, double Seconds)> Stages => _stages;

    public double TotalS => _stages.Sum(s => s.Seconds);

    public void Add(string stage, double seconds)
    {
        var i = _stages.FindIndex(s => s.Stage == stage);
        if (i < 0)
        {
            _stages.Add((stage, seconds));
        }
        else
        {
            _stages[i] = (stage, _stages[i].Seconds + seconds);
        }
    }

    /// <summary>Splits a beats pass of <paramref name="passS"/> seconds into reading and the beats stage's parts.</summary>
    public void AddBeatsPass(double passS, BeatStageTimings parts)
    {
        var named = new[]
        {
            ("conditioning", parts.Conditioning), ("quality", parts.Quality), ("detection", parts.Detection),
            ("delineation", parts.Delineation), ("classification", parts.Classification),
        };
        var partsS = named.Sum(p => BeatStageTimings.Seconds(p.Item2));
        Add("read", Math.Max(0, passS - partsS));
        foreach (var (stage, ticks) in named)
        {
            Add(stage, BeatStageTimings.Seconds(ticks));
        }
    }

    /// <summary>Adds every stage of <paramref name="other"/> (batch totals).</summary>
    public void AddAll(StageTimings other)
    {
        foreach (var (stage, s) in other.Stages)
        {
            Add(stage, s);
        }
    }

    public override string ToString()
    {
        var text = new StringBuilder();
        foreach (var (stage, s) in _stages)
        {
            text.Append(text.Length == 0 ? "" : ", ").Append(CultureInfo.InvariantCulture, $"{stage} {s:F2} s");
        }

        return text.Append(CultureInfo.InvariantCulture, $" (total {TotalS:F2} s)").ToString();
    }
}

/// <summary>
/// Hooks of one summary run for the batch: stage times, and a last word in the output folder before it is renamed
/// into place (the batch writes the recording's fingerprint there, so fingerprint and outputs appear together).
/// </summary>
public sealed class SummaryObserver
{
    private long _mark = Stopwatch.GetTimestamp();

    /// <summary>Called with the temporary output folder once every output is written, just before the rename.</summary>
    public Action<string>? BeforeCommit { get; init; }

    public StageTimings Timings { get; } = new();

    /// <summary>Starts timing the first stage.</summary>
    public void Start() => _mark = Stopwatch.GetTimestamp();

    /// <summary>Closes the stage that ran since the last mark.</summary>
    public void Mark(string stage)
    {
        var now = Stopwatch.GetTimestamp();
        Timings.Add(stage, Stopwatch.GetElapsedTime(_mark, now).TotalSeconds);
        _mark = now;
    }

    /// <summary>Closes the beats pass (reading plus the beats stage), split into its parts.</summary>
    public void MarkBeats(BeatStageTimings? parts)
    {
        var now = Stopwatch.GetTimestamp();
        var s = Stopwatch.GetElapsedTime(_mark, now).TotalSeconds;
        if (parts is null)
        {
            Timings.Add("beats", s);
        }
        else
        {
            Timings.AddBeatsPass(s, parts);
        }

        _mark = now;
    }

    public void Committing(string workPath) => BeforeCommit?.Invoke(workPath);
}
