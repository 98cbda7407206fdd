using System.Diagnostics;
using System.Globalization;
using System.Text;
using LongRecord.Analysis.Beats;

namespace LongRecord.Pipeline.Batch;

/// <summary>
/// Wall time per stage of one recording's summary: reading (decode and everything of the beats pass that is not one of
/// its parts), the beats stage's parts (<see cref="BeatStageTimings"/>), the stages after it, and writing the outputs.
/// When the beats stage ran on two threads its parts overlap: the pass is one stage, <c>beats</c>, of wall time, and
/// its parts are listed apart as thread time (<see cref="OverlappedParts"/>), outside the total.
/// </summary>
public sealed class StageTimings
{
    private readonly List<(string Stage, double Seconds)> _stages = [];
    private readonly List<(string Stage, double Seconds)> _overlapped = [];

    public IReadOnlyList<(string Stage, double Seconds)> Stages => _stages;

    /// <summary>Thread time of the beats stage's parts when they ran side by side (not part of <see cref="TotalS"/>).</summary>
    public IReadOnlyList<(string Stage, double Seconds)> OverlappedParts => _overlapped;

    public double TotalS => _stages.Sum(s => s.Seconds);

    public void Add(string stage, double seconds) => Add(_stages, stage, seconds);

    private static void Add(List<(string Stage, double Seconds)> list, string stage, double seconds)
    {
        var i = list.FindIndex(s => s.Stage == stage);
        if (i < 0)
        {
            list.Add((stage, seconds));
        }
        else
        {
            list[i] = (stage, list[i].Seconds + seconds);
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
        if (parts.TwoThreads)
        {
            Add("beats", passS);
            foreach (var (stage, ticks) in named)
            {
                Add(_overlapped, stage, BeatStageTimings.Seconds(ticks));
            }

            return;
        }

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

        foreach (var (stage, s) in other.OverlappedParts)
        {
            Add(_overlapped, stage, s);
        }
    }

    public override string ToString()
    {
        var text = new StringBuilder();
        foreach (var (stage, s) in _stages)
        {
            text.Append(text.Length == 0 ? "" : ", ").Append(CultureInfo.InvariantCulture, $"{stage} {s:F2} s");
        }

        text.Append(CultureInfo.InvariantCulture, $" (total {TotalS:F2} s)");
        if (_overlapped.Count > 0)
        {
            text.Append("; beats on more than one thread, thread time (wall, waiting for a core included):");
            foreach (var (stage, s) in _overlapped)
            {
                text.Append(CultureInfo.InvariantCulture, $" {stage} {s:F2} s");
            }
        }

        return text.ToString();
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
