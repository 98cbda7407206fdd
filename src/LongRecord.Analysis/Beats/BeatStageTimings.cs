using System.Diagnostics;

namespace LongRecord.Analysis.Beats;

/// <summary>Time spent in each part of the beats stage, in <see cref="Stopwatch"/> ticks.</summary>
public sealed class BeatStageTimings
{
    public long Conditioning { get; set; }
    public long Quality { get; set; }
    public long Detection { get; set; }
    public long Delineation { get; set; }
    public long Classification { get; set; }

    /// <summary>True when delineation and classification ran on a second thread, overlapping the other parts.</summary>
    public bool TwoThreads { get; set; }

    public static double Seconds(long ticks) => (double)ticks / Stopwatch.Frequency;

    public override string ToString() => FormattableString.Invariant(
        $"conditioning {Seconds(Conditioning):F2} s, quality {Seconds(Quality):F2} s, detection {Seconds(Detection):F2} s, delineation {Seconds(Delineation):F2} s, classification {Seconds(Classification):F2} s");
}
