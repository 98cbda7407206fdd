using LongRecord.Synthesis.Scenarios;

namespace LongRecord.Synthesis.Timeline;

/// <summary>One placed segment: a scenario segment on the recording's time axis (after repeating or cutting).</summary>
internal sealed record PlacedSegment(ScenarioSegment Segment, int SegmentIndex, int Cycle, double StartS, double EndS);

/// <summary>One placed noise stretch on the recording's time axis.</summary>
internal sealed record PlacedNoise(NoiseStretch Stretch, int StretchIndex, double StartS, double EndS);

/// <summary>Lays the scenario timeline on the recording's time axis: repeated cyclically or cut to the total length.</summary>
internal static class TimelinePlan
{
    public static (IReadOnlyList<PlacedSegment> Segments, IReadOnlyList<PlacedNoise> Noise) Place(Scenario scenario, double durationS)
    {
        var cycleS = scenario.TimelineDurationS;
        var segments = new List<PlacedSegment>();
        var noise = new List<PlacedNoise>();
        for (var cycle = 0; cycle * cycleS < durationS; cycle++)
        {
            var offset = cycle * cycleS;
            var t = offset;
            for (var i = 0; i < scenario.Segments.Count && t < durationS; i++)
            {
                var seg = scenario.Segments[i];
                var end = Math.Min(t + seg.DurationS, durationS);
                segments.Add(new PlacedSegment(seg, i, cycle, t, end));
                t += seg.DurationS;
            }

            for (var i = 0; i < scenario.Noise.Count; i++)
            {
                var n = scenario.Noise[i];
                var start = offset + n.StartS;
                if (start < durationS)
                {
                    noise.Add(new PlacedNoise(n, i, start, Math.Min(start + n.DurationS, durationS)));
                }
            }
        }

        noise.Sort((a, b) => a.StartS.CompareTo(b.StartS));
        return (segments, noise);
    }
}
